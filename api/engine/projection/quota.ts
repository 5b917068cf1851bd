/**
 * From the bootstrap distribution of the collapse point (the fold harvest h* under a catch, or the
 * collapse F* under a fishing mortality) to a quota proposal: the largest level whose probability of
 * exceeding the collapse point stays under a chosen risk (a "P*"-style buffer, common practice),
 * capped by the ramp rule, an F rule F = F_target·F_MSY·min(1, (B/B_MSY − limit)/(trigger − limit)),
 * zero below the limit (common practice; our name for this family of harvest control rules).
 */
import { quantile, type Replicate } from '../uncertainty/bootstrap';
import type { HarvestControl } from '../surplus/surplus';

export interface RampRule {
  /** B/B_MSY below which the rule allows no catch: the run's one limit reference point. */
  limit: number;
  /** B/B_MSY above which the full target F applies. */
  trigger: number;
  /** Target fishing mortality as a multiple of F_MSY (common practice: ≤ 1). */
  fTargetOverFmsy: number;
}

export interface QuotaProposal {
  /** How the levels below are expressed (absent in runs stored before F proposals: a catch). */
  control?: HarvestControl;
  /** Level at the chosen risk quantile of the bootstrap collapse point. */
  foldLimitedCatch: number;
  /** Level the ramp rule allows at the current status. */
  rampCatch: number;
  proposed: number;
  bindingConstraint: 'fold-risk' | 'ramp-rule';
  risk: number;
  /** Collapse point (h*, or F* under F): bootstrap median, 5% and 95%. */
  hStar: { median: number; lower5: number; upper95: number };
  /** Distance from the proposal to the median collapse point, in its units and as a fraction of it. */
  marginToFold: { absolute: number; fraction: number };
  /** Same distance to the lower 5% of the collapse point. */
  marginToFoldLower: { absolute: number; fraction: number };
  /** Share of replicates whose collapse point lies below the proposal. */
  pPassFold: number;
}

/** F the ramp rule sets for biomass B. */
export function rampF(rule: RampRule, B: number, bMsy: number, fMsy: number): number {
  const status = B / bMsy;
  if (status <= rule.limit) return 0;
  return rule.fTargetOverFmsy * fMsy * Math.min(1, (status - rule.limit) / (rule.trigger - rule.limit));
}

/** Catch the ramp rule allows for biomass B with reference points F_MSY and B_MSY (its F times B). */
export function rampCatch(rule: RampRule, B: number, bMsy: number, fMsy: number): number {
  return rampF(rule, B, bMsy, fMsy) * B;
}

/** Empirical quantile that tolerates infinite values (a replicate without a collapse point). */
function safeQuantile(values: number[], p: number): number {
  const s = [...values].sort((a, b) => a - b);
  const h = (s.length - 1) * p;
  const lo = Math.floor(h);
  const a = s[lo]!, b = s[Math.min(lo + 1, s.length - 1)]!;
  return a === b || h === lo ? a : quantile(values, p);
}

/** The collapse point of each replicate under the control. */
export function collapsePoints(replicates: Replicate[], control: HarvestControl): number[] {
  return replicates.map((r) => (control === 'catch' ? r.hStar : r.fStar ?? Infinity));
}

/** The proposal: the smaller of the fold-risk level and the ramp-rule level. */
export function proposeQuota(replicates: Replicate[], current: { B: number; bMsy: number; fMsy: number }, risk: number, rule: RampRule, control: HarvestControl = 'catch'): QuotaProposal {
  if (!(risk > 0 && risk < 0.5)) throw new Error('risk must be between 0 and 0.5');
  if (!(rule.limit >= 0 && rule.trigger > rule.limit)) throw new Error('the ramp rule needs 0 ≤ limit < trigger');
  const h = collapsePoints(replicates, control);
  const foldLimitedCatch = safeQuantile(h, risk);
  const ramp = control === 'catch' ? rampCatch(rule, current.B, current.bMsy, current.fMsy) : rampF(rule, current.B, current.bMsy, current.fMsy);
  const proposed = Math.min(foldLimitedCatch, ramp);
  const median = safeQuantile(h, 0.5);
  const lower5 = safeQuantile(h, 0.05);
  const margin = (ref: number) => (Number.isFinite(ref) ? { absolute: ref - proposed, fraction: (ref - proposed) / ref } : { absolute: Infinity, fraction: 1 });
  return {
    control, foldLimitedCatch, rampCatch: ramp, proposed, bindingConstraint: proposed === ramp && ramp < foldLimitedCatch ? 'ramp-rule' : 'fold-risk', risk,
    hStar: { median, lower5, upper95: safeQuantile(h, 0.95) },
    marginToFold: margin(median), marginToFoldLower: margin(lower5),
    pPassFold: h.filter((v) => v < proposed).length / h.length,
  };
}
