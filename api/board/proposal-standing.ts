/** Lists of proposals with their drafter's name, stock, region and standing with the board. */
import { Advisory } from '../advisories/advisory.model';
import type { Proposal } from '../proposals/proposal.model';
import type { ProposalListItem, ProposalStanding } from '../proposals/proposal.schemas';
import { Region } from '../regions/region.model';
import { Stock } from '../stocks/stock.model';
import { userNames } from '../users/user-names';
import { Decision } from './board.models';

/** The board's decision on each proposal and the limit now in force (following corrections to the newest advisory). */
export async function standings(proposalIds: number[]): Promise<Map<number, ProposalStanding>> {
  if (proposalIds.length === 0) return new Map();
  const decisions = await Decision.findAll({ where: { proposalId: proposalIds } });
  const approved = decisions.filter((d) => d.outcome === 'approved');
  const own = approved.length ? await Advisory.findAll({ where: { decisionId: approved.map((d) => d.id) }, attributes: ['id', 'decisionId'] }) : [];
  const all = own.length ? await Advisory.findAll({ attributes: ['id', 'approvedLimit', 'supersededById'] }) : [];
  const byId = new Map(all.map((a) => [a.id, a]));
  const inForce = (id: number) => {
    let a = byId.get(id);
    for (let i = 0; a?.supersededById && i < 100; i++) a = byId.get(a.supersededById);
    return a;
  };
  return new Map(decisions.map((d) => {
    const first = own.filter((a) => a.decisionId === d.id).sort((x, y) => x.id - y.id)[0];
    const current = first ? inForce(first.id) : undefined;
    return [d.proposalId, {
      outcome: d.outcome, limit: current?.approvedLimit ?? d.approvedLimit, corrected: !!current && current.id !== first?.id, decidedAt: d.createdAt.toISOString(),
    }];
  }));
}

/** Proposal rows ready for a list. */
export async function listItems(rows: Proposal[]): Promise<ProposalListItem[]> {
  const [names, stand, stocks] = await Promise.all([
    userNames(rows.map((p) => p.createdBy)),
    standings(rows.filter((p) => p.status === 'submitted').map((p) => p.id)),
    Stock.findAll({ where: { id: [...new Set(rows.map((p) => p.stockId))] }, attributes: ['id', 'name', 'regionId'] }),
  ]);
  const regions = stocks.length ? await Region.findAll({ where: { id: [...new Set(stocks.map((s) => s.regionId))] }, attributes: ['id', 'name'] }) : [];
  return rows.map((p) => {
    const stock = stocks.find((s) => s.id === p.stockId);
    return {
      ...p.toView(names.get(p.createdBy) ?? null),
      stockName: stock?.name ?? '', regionName: regions.find((r) => r.id === stock?.regionId)?.name ?? '', standing: stand.get(p.id) ?? null,
    };
  });
}
