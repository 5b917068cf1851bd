/**
 * From the bootstrap distribution of the fold harvest to a quota proposal: the largest catch whose
 * probability of exceeding h* stays under a chosen risk (a "P*"-style buffer, common practice), capped
 * by the ramp rule: a hockey-stick F = F_target·min(1, (B/B_MSY − limit)/(trigger − limit)), zero
 * below the limit (common practice; our name for this family of harvest control rules).
 */
import { quantile, type Replicate } from '../uncertainty/bootstrap';

export interface RampRule {
  /** B/B_MSY below which the rule allows no catch. */
  limit: number;
  /** B/B_MSY above which the full target F applies. */
  trigger: number;
  /** Target fishing mortality as a multiple of F_MSY (common practice: ≤ 1). */
  fTargetOverFmsy: number;
}

export interface QuotaProposal {
  /** Catch at the chosen risk quantile of the bootstrap h* distribution. */
  foldLimitedCatch: number;
  /** Catch the ramp rule allows at the current status. */
  rampCatch: number;
  proposed: number;
  bindingConstraint: 'fold-risk' | 'ramp-rule';
  risk: number;
  hStar: { median: number; lower5: number; upper95: number };
  /** Distance from the proposal to the median fold harvest, in catch units and as a fraction of it. */
  marginToFold: { absolute: number; fraction: number };
  /** Same distance to the lower 5% of the fold harvest. */
  marginToFoldLower: { absolute: number; fraction: number };
  /** Share of replicates whose h* lies below the proposal. */
  pPassFold: number;
}

/** Catch the ramp rule allows for biomass B with reference points F_MSY and B_MSY. */
export function rampCatch(rule: RampRule, B: number, bMsy: number, fMsy: number): number {
  const status = B / bMsy;
  if (status <= rule.limit) return 0;
  const ramp = Math.min(1, (status - rule.limit) / (rule.trigger - rule.limit));
  return rule.fTargetOverFmsy * fMsy * ramp * B;
}

/** The proposal: the smaller of the fold-risk catch and the ramp-rule catch. */
export function proposeQuota(replicates: Replicate[], current: { B: number; bMsy: number; fMsy: number }, risk: number, rule: RampRule): QuotaProposal {
  if (!(risk > 0 && risk < 0.5)) throw new Error('risk must be between 0 and 0.5');
  if (!(rule.limit >= 0 && rule.trigger > rule.limit)) throw new Error('the ramp rule needs 0 ≤ limit < trigger');
  const h = replicates.map((r) => r.hStar);
  const foldLimitedCatch = quantile(h, risk);
  const ramp = rampCatch(rule, current.B, current.bMsy, current.fMsy);
  const proposed = Math.min(foldLimitedCatch, ramp);
  const median = quantile(h, 0.5);
  const lower5 = quantile(h, 0.05);
  return {
    foldLimitedCatch, rampCatch: ramp, proposed, bindingConstraint: proposed === ramp && ramp < foldLimitedCatch ? 'ramp-rule' : 'fold-risk', risk,
    hStar: { median, lower5, upper95: quantile(h, 0.95) },
    marginToFold: { absolute: median - proposed, fraction: (median - proposed) / median },
    marginToFoldLower: { absolute: lower5 - proposed, fraction: (lower5 - proposed) / lower5 },
    pPassFold: h.filter((v) => v < proposed).length / h.length,
  };
}
