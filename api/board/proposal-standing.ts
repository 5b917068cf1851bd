/** Lists of proposals with their drafter's name, stock, region and standing with the board. */
import { Advisory } from '../advisories/advisory.model';
import type { Proposal } from '../proposals/proposal.model';
import type { ProposalListItem, ProposalStanding } from '../proposals/proposal.schemas';
import { Region } from '../regions/region.model';
import { Stock } from '../stocks/stock.model';
import { userNames } from '../users/user-names';
import { Decision } from './board.models';

/** The board's decision on each proposal and the limit now in force. */
export async function standings(proposalIds: number[]): Promise<Map<number, ProposalStanding>> {
  if (proposalIds.length === 0) return new Map();
  const decisions = await Decision.findAll({ where: { proposalId: proposalIds } });
  const advisories = decisions.length ? await Advisory.findAll({
    where: { decisionId: decisions.map((d) => d.id), supersededById: null }, attributes: ['id', 'decisionId', 'approvedLimit', 'supersedesId'],
  }) : [];
  return new Map(decisions.map((d) => {
    const current = advisories.find((a) => a.decisionId === d.id);
    return [d.proposalId, {
      outcome: d.outcome, limit: current?.approvedLimit ?? d.approvedLimit, corrected: !!current?.supersedesId, decidedAt: d.createdAt.toISOString(),
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
