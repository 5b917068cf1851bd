import { Pipe, PipeTransform } from '@angular/core';
import type { ProposalListItem } from '../../api/proposals/proposal.schemas';

const n0 = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 0 });

/** Where a proposal stands, in words: "Draft", "Submitted", "Approved: 1,750 t (corrected)", "Rejected". */
@Pipe({ name: 'standing' })
export class StandingPipe implements PipeTransform {
  transform(p: ProposalListItem): string {
    if (p.status === 'draft') return 'Draft';
    const s = p.standing;
    if (!s) return 'Submitted, awaiting the board';
    if (s.outcome === 'rejected') return 'Rejected by the board';
    return `Approved: ${s.limit === null ? '' : n0.format(s.limit) + ' ' + p.figures.unit}${s.corrected ? ' (corrected)' : ''}`;
  }
}
