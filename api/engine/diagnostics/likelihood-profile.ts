/**
 * Likelihood profiles of r, K and MSY (and h*, which equals MSY for these concave production models):
 * hold the parameter, refit the others, and read the 95% interval where the negative log-likelihood
 * rises χ²₁(0.95)/2 = 1.92 above its minimum (standard likelihood theory; Venzon & Moolgavkar 1988).
 */
import { fitSurplusRaw, surplusProblem, type SurplusFitOptions } from '../surplus/fit-surplus';
import { toFree } from '../numerics/transforms';
import type { StockSeries } from '../data/series';
import type { SurplusFitSummary } from '../fit/fit-summary';

/** Half the 95% quantile of χ² with one degree of freedom. */
export const PROFILE_DROP = 1.920729410347062;

export type ProfiledName = 'r' | 'K' | 'MSY' | 'h*';

export interface Profile {
  name: ProfiledName;
  mle: number;
  /** Points of the profile: the held value and the rise of the negative log-likelihood above its minimum. */
  points: { value: number; delta: number }[];
  /** 95% profile interval; a side is null where the profile stays below 1.92 up to the parameter's bound. */
  interval: [number | null, number | null];
  /** Set when a held value found a better fit than the maximum-likelihood fit (the fit had not converged). */
  betterFit: boolean;
}

type Key = 'r' | 'K' | 'msy';

/** The minimum objective with one parameter held, warm-started from the natural values of a nearby solution. */
function heldFit(series: StockSeries, opts: SurplusFitOptions, key: Key, value: number, warm: Record<string, number>) {
  const o: SurplusFitOptions = { ...opts, fixed: { ...opts.fixed, [key]: value }, starts: 2 };
  const problem = surplusProblem(series, o);
  const initial = problem.bounds.map((b) => toFree(b, warm[b.name]!));
  const raw = fitSurplusRaw(series, { ...o, initial });
  const p = raw.problem.decode(raw.u);
  return { nll: raw.nll, natural: { r: p.r, K: p.K, d0: p.d0, p: p.p ?? 1 } as Record<string, number> };
}

/** Profiles one parameter; `limits` bound the walk on each side (natural scale). */
export function profileParameter(series: StockSeries, opts: SurplusFitOptions, fit: SurplusFitSummary, name: 'r' | 'K' | 'MSY', limits: [number, number]): Profile {
  const key: Key = name === 'MSY' ? 'msy' : name;
  const mle = name === 'MSY' ? fit.reference.msy : fit.params[key as 'r' | 'K'];
  const nll0 = -fit.logLik - (fit.logPrior ?? 0);
  const start: Record<string, number> = { r: fit.params.r, K: fit.params.K, d0: fit.params.d0, p: fit.params.p };
  const points: { value: number; delta: number }[] = [{ value: mle, delta: 0 }];
  let best = nll0;
  const ends: (number | null)[] = [];
  for (const dir of [-1, 1]) {
    const limit = dir < 0 ? limits[0] : limits[1];
    let warm = start;
    let prev = { logv: Math.log(mle), delta: 0, warm: start };
    let step = 0.05;
    let end: number | null = null;
    for (let i = 0; i < 40; i++) {
      const logv = prev.logv + dir * step;
      if (dir < 0 ? logv < Math.log(limit) : logv > Math.log(limit)) break;
      const h = heldFit(series, opts, key, Math.exp(logv), warm);
      best = Math.min(best, h.nll);
      const delta = h.nll - nll0;
      points.push({ value: Math.exp(logv), delta });
      if (delta >= PROFILE_DROP) {
        // bisect on the log scale between the last point below and this one
        let lo = prev.logv, hi = logv, wLo = prev.warm;
        for (let k = 0; k < 6; k++) {
          const mid = (lo + hi) / 2;
          const m = heldFit(series, opts, key, Math.exp(mid), wLo);
          points.push({ value: Math.exp(mid), delta: m.nll - nll0 });
          if (m.nll - nll0 < PROFILE_DROP) { lo = mid; wLo = m.natural; } else hi = mid;
        }
        const dl = points.find((p) => p.value === Math.exp(lo))?.delta ?? 0;
        const dh = points.find((p) => p.value === Math.exp(hi))!.delta;
        end = Math.exp(lo + ((PROFILE_DROP - dl) / (dh - dl)) * (hi - lo));
        break;
      }
      if (delta - prev.delta < 0.25) step = Math.min(step * 1.6, 0.6);
      warm = h.natural;
      prev = { logv, delta, warm };
    }
    ends.push(end);
  }
  points.sort((a, b) => a.value - b.value);
  return { name, mle, points, interval: [ends[0]!, ends[1]!], betterFit: best < nll0 - 1e-3 };
}

/** Profiles of r, K, MSY and h* (h* = MSY here: the fold of a concave production curve under constant catch is at MSY). */
export function profiles(series: StockSeries, opts: SurplusFitOptions, fit: SurplusFitSummary, onDone?: (name: string) => void): Profile[] {
  const scale = Math.max(...fit.catches, 1e-9);
  const held = new Set(Object.keys(opts.fixed ?? {}).filter((k) => k !== 'q'));
  const out: Profile[] = [];
  if (!held.has('r')) { out.push(profileParameter(series, opts, fit, 'r', [0.005, 3])); onDone?.('r'); }
  if (!held.has('K')) { out.push(profileParameter(series, opts, fit, 'K', [0.5 * scale, 1e4 * scale])); onDone?.('K'); }
  if (!held.has('r') || !held.has('K')) {
    const msy = profileParameter(series, opts, fit, 'MSY', [fit.reference.msy / 50, fit.reference.msy * 50]);
    out.push(msy, { ...msy, name: 'h*' });
    onDone?.('MSY');
  }
  return out;
}
