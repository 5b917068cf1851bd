/** Every diagnostic a review asks of a surplus-production fit, computed in one pass with progress. */
import type { SurplusFitOptions } from '../surplus/fit-surplus';
import type { SurplusFitSummary } from '../fit/fit-summary';
import type { StockSeries } from '../data/series';
import { residualCheck, type ResidualCheck } from './residual-checks';
import { feasiblePeels, hindcast, mohnsRho, peelFit, type HindcastIndex, type PeelPath } from './retrospective';
import { profiles, type Profile } from './likelihood-profile';
import { jitterFit, type Jitter } from './jitter';

/**
 * Acceptance ranges for Mohn's rho of biomass and F: −0.15 to 0.20 for longer-lived stocks,
 * −0.22 to 0.30 for shorter-lived (Hurtado-Ferro et al. 2015, ICES J. Mar. Sci. 72:99; common practice).
 */
export const RHO_ACCEPTANCE = { longLived: [-0.15, 0.2] as [number, number], shortLived: [-0.22, 0.3] as [number, number] };

export interface SurplusDiagnostics {
  /** Schema version of this block. */
  version: 1;
  residuals: ResidualCheck[];
  retrospective: {
    peels: PeelPath[];
    mohnsRho: { biomass: number; F: number };
    acceptance: typeof RHO_ACCEPTANCE;
  } | null;
  hindcast: HindcastIndex[];
  profiles: Profile[];
  jitter: Jitter | null;
}

export interface DiagnoseOptions {
  /** Years to peel (default 5). */
  peel?: number;
  /** Jitter starts (default 20; 0 skips). */
  jitter?: number;
  seed?: number;
  onProgress?: (fraction: number, stage: string) => void;
}

/** Residual checks, retrospective with Mohn's rho, hindcast MASE, likelihood profiles and jitter. */
export function diagnoseSurplus(series: StockSeries, opts: SurplusFitOptions, fit: SurplusFitSummary, d: DiagnoseOptions = {}): SurplusDiagnostics {
  const progress = d.onProgress ?? (() => undefined);
  const residuals = fit.indices.map((ix) => residualCheck(ix.name, fit.years, ix.residuals));
  const nPeel = feasiblePeels(series, d.peel ?? 5);
  const peels: PeelPath[] = [];
  for (let p = 1; p <= nPeel; p++) {
    progress((p - 1) / (nPeel + 5), `Retrospective: refit without the last ${p} year${p > 1 ? 's' : ''}`);
    peels.push(peelFit(series, opts, p, fit.free));
  }
  const n = fit.years.length;
  const fullB = fit.biomass.slice(0, n);
  const fullF = fullB.map((b, t) => fit.catches[t]! / Math.max(b, 1e-12));
  const full: PeelPath = {
    peel: 0, years: fit.years, biomass: fullB, F: fullF, bOverBmsy: fullB.map((b) => b / fit.reference.bMsy),
    fOverFmsy: fullF.map((f) => f / fit.reference.fMsy), bNext: fit.biomass[n]!, q: fit.indices.map((i) => i.q),
  };
  const retrospective = peels.length ? {
    peels: [full, ...peels],
    mohnsRho: {
      biomass: mohnsRho(fullB, peels.map((p) => ({ peel: p.peel, values: p.biomass }))),
      F: mohnsRho(fullF, peels.map((p) => ({ peel: p.peel, values: p.F }))),
    },
    acceptance: RHO_ACCEPTANCE,
  } : null;
  progress(nPeel / (nPeel + 5), 'Likelihood profiles');
  const prof = profiles(series, opts, fit, (name) => progress((nPeel + (name === 'r' ? 1 : name === 'K' ? 2 : 3)) / (nPeel + 5), `Likelihood profile of ${name} done`));
  const nJ = d.jitter ?? 20;
  progress((nPeel + 4) / (nPeel + 5), `Jitter: ${nJ} refits from perturbed starts`);
  const jitter = nJ > 0 && fit.free.length > 0 ? jitterFit(series, opts, fit.free, -fit.logLik - (fit.logPrior ?? 0), nJ, d.seed ?? 1) : null;
  progress(1, 'Diagnostics done');
  return { version: 1, residuals, retrospective, hindcast: hindcast(series, peels), profiles: prof, jitter };
}
