/** Turns a raw surplus-production fit into what an assessor reads: estimates with intervals, diagnostics. */
import { covarianceFromHessian, deltaVariance, gradient, hessian } from '../numerics/hessian';
import { concentratedIndexFit } from './likelihood';
import { referencePoints } from '../surplus/surplus';
import type { RawFit } from '../surplus/fit-surplus';
import type { StockSeries } from '../data/series';
import { rangePosition, toNatural } from '../numerics/transforms';
import { analyseEquilibria } from '../surplus/equilibria';
import { productionModel } from '../surplus/registry';
import { profileInterval, smallSampleDrop, type ProfileInterval } from './profile';

export interface Estimate {
  name: string;
  value: number;
  /** Approximate standard error from the inverse Hessian (delta method), or null. */
  se: number | null;
  /** 95% interval (profile likelihood for r, K, MSY, h* and parameters on a bound; else log-normal from the Hessian), or null. */
  ci95: [number, number] | null;
  /** How the interval was found (absent in runs stored before profiles). */
  method?: 'profile' | 'hessian';
  /** A side the data do not close: the interval is one-sided there (it ends at the parameter's bound). */
  open?: { lower: boolean; upper: boolean };
}

export interface IndexSummary {
  name: string;
  q: number;
  sigma: number;
  /** Log residuals per year (null where no observation). */
  residuals: (number | null)[];
  /** Fitted index q̂·B_t per year. */
  fitted: number[];
}

export interface Convergence {
  converged: boolean;
  iterations: number;
  evaluations: number;
  simplexSize: number;
  gradientNorm: number;
  startsRun: number;
  startsAgreeing: number;
  warnings: string[];
}

export interface SurplusFitSummary {
  model: string;
  /** Parameters held at a value rather than estimated (by name: r, K, B0/K, q of a survey). */
  fixed?: string[];
  /** True when priors were given: logLik is then the data part and `logPrior` the penalty's log density. */
  penalised?: boolean;
  logPrior?: number;
  /** What was fixed or given a prior, in words (empty for a plain fit). */
  constraints?: string;
  years: number[];
  params: { r: number; K: number; d0: number; p: number; A?: number; c?: number; a?: number };
  free: number[];
  estimates: Estimate[];
  logLik: number;
  aic: number;
  aicc: number;
  nParams: number;
  nObs: number;
  indices: IndexSummary[];
  /** Biomass at the start of each year and at the end of the last year. */
  biomass: number[];
  catches: number[];
  filledCatchYears: number[];
  reference: { msy: number; bMsy: number; fMsy: number };
  /** Fold harvest: the largest constant catch with a positive stable equilibrium. */
  hStar: number;
  status: { year: number; bOverBmsy: number; fOverFmsy: number };
  convergence: Convergence;
}

/** Fold harvest under a constant catch: MSY for concave production, lower with depensation. */
function foldHarvestOf(fit: RawFit, u: number[]): number {
  return analyseEquilibria(productionModel(fit.problem.model), fit.problem.decode(u), 'catch').collapse?.at ?? 0;
}

/** Derived quantities, each a function of the free parameters. */
function derived(fit: RawFit) {
  const { problem } = fit;
  const last = problem.catches.length - 1;
  const ref = (u: number[]) => referencePoints(problem.model, problem.decode(u));
  const bEnd = (u: number[]) => problem.path(u).biomass[last + 1]!;
  const bLast = (u: number[]) => problem.path(u).biomass[last]!;
  const first = problem.bounds.length - problem.shapes.length;
  const q: [string, (u: number[]) => number][] = [
    ['r', (u) => problem.decode(u).r],
    ['K', (u) => problem.decode(u).K],
    ['B0/K', (u) => problem.decode(u).d0],
    ...problem.shapes.map((sh, i): [string, (u: number[]) => number] => [sh.label, (u) => toNatural(problem.bounds[first + i]!, u[first + i]!)]),
  ];
  q.push(
    ['MSY', (u) => ref(u).msy],
    ['B_MSY', (u) => ref(u).bMsy],
    ['F_MSY', (u) => ref(u).fMsy],
    ['h*', (u) => foldHarvestOf(fit, u)],
    ['B/B_MSY', (u) => bEnd(u) / ref(u).bMsy],
    ['F/F_MSY', (u) => problem.catches[last]! / Math.max(bLast(u), 1e-12) / ref(u).fMsy],
  );
  return q;
}

/** Estimates, intervals, information criteria, residuals and convergence diagnostics. */
export function summariseFit(series: StockSeries, fit: RawFit, { intervals: wantIntervals = true, constraints = '', profiles = productionModel(fit.problem.model).stepper !== 'odex' } = {}): SurplusFitSummary {
  const { problem, u } = fit;
  const intervals = wantIntervals && u.length > 0;
  const params = problem.decode(u);
  const ref = referencePoints(problem.model, params);
  const { biomass } = problem.path(u);
  const warnings: string[] = [];
  if (problem.filledYears.length) warnings.push(`Catch missing in ${problem.filledYears.join(', ')}: filled by linear interpolation.`);

  const H = intervals ? hessian(problem.nll, u) : null;
  const cov = H ? covarianceFromHessian(H) : null;
  if (cov && !cov.cov) warnings.push('The Hessian is not positive definite: the fit is not identifiable from these data; intervals are withheld.');
  else if (cov && cov.conditionNumber > 1e8) warnings.push(`The Hessian is ill-conditioned (condition number ${cov.conditionNumber.toExponential(1)}): parameters are weakly identified.`);
  const iR = problem.bounds.findIndex((b) => b.name === 'r'), iK = problem.bounds.findIndex((b) => b.name === 'K');
  if (cov?.cov && iR >= 0 && iK >= 0) {
    const c = cov.cov;
    const rho = c[iR]![iK]! / Math.sqrt(c[iR]![iR]! * c[iK]![iK]!);
    if (Math.abs(rho) > 0.95) warnings.push(`r and K are strongly correlated (ρ = ${rho.toFixed(2)} on the fitted scale): their product (MSY) is better determined than either.`);
  }
  const onBound = new Set<string>();
  problem.bounds.forEach((b, i) => {
    const pos = rangePosition(u[i]!);
    if (pos < 1e-3 || pos > 1 - 1e-3) {
      const label = b.name === 'd0' ? 'B0/K' : b.name;
      onBound.add(label);
      // a stock that starts at its carrying capacity is an ordinary finding, not a poorly determined one
      if (b.name === 'd0' && pos > 0.5 && b.hi === 1) return;
      warnings.push(`${b.name === 'p' ? 'The Pella-Tomlinson shape p' : label} sits on its bound (${b.lo}–${b.hi}): it is poorly determined by these data and its interval is one-sided.`);
    }
  });
  if (params.d0 > 1) warnings.push(`The first year's biomass is estimated above K (B0/K = ${params.d0.toFixed(2)}), as allowed for this run: check that the stock really started above its carrying capacity.`);
  const agreeing = fit.startValues.filter((v) => v - fit.nll < 0.01).length;
  const spread = fit.startPoints.filter((_, i) => fit.startValues[i]! - fit.nll < 0.01)
    .some((x) => Math.abs(problem.decode(x).r / params.r - 1) > 0.05);
  if (spread) warnings.push('Starts that reach the same likelihood give r differing by more than 5%: the likelihood surface is flat.');
  if (fit.hitIterationLimit) warnings.push('The optimiser stopped at its iteration limit.');
  const grad = intervals ? gradient(problem.nll, u) : u.map(() => 0);
  const gradientNorm = Math.hypot(...grad);
  if (intervals && gradientNorm > 1e-2) warnings.push(`The gradient at the optimum is ${gradientNorm.toExponential(1)}: the fit may not have converged.`);

  const drop = smallSampleDrop(problem.nObs, problem.bounds.length + series.indices.length);
  const profiled = new Set(['r', 'K', 'MSY', 'h*', ...onBound]);
  const done = new Map<string, ProfileInterval>();
  const estimates: Estimate[] = derived(fit).map(([name, g]) => {
    const value = g(u);
    const seLog = cov?.cov && value > 0 ? Math.sqrt(Math.max(deltaVariance((x) => Math.log(g(x)), u, cov.cov), 0)) : null;
    const boundName = name === 'B0/K' ? 'd0' : name;
    if (intervals && (profiles || onBound.has(name)) && profiled.has(name) && (problem.bounds.some((b) => b.name === boundName) || (['MSY', 'h*'].includes(name) && problem.bounds[0]?.name === 'r'))) {
      // for concave production h* is MSY: one profile serves both
      const same = name === 'h*' && Math.abs(value / ref.msy - 1) < 1e-9 ? done.get('MSY') : undefined;
      const pi = same ?? profileInterval(fit, boundName, { threshold: drop, initialStep: seLog && seLog < 1 ? Math.max(0.01, seLog) : 0.05 });
      done.set(name, pi);
      return { name, value, se: seLog === null ? null : value * seLog, ci95: [pi.lower, pi.upper], method: 'profile', open: { lower: pi.lowerOpen, upper: pi.upperOpen } };
    }
    if (seLog === null) return { name, value, se: null, ci95: null };
    return { name, value, se: value * seLog, ci95: [value * Math.exp(-1.96 * seLog), value * Math.exp(1.96 * seLog)], method: 'hessian' };
  });

  const shape = estimates.find((e) => e.name === 'p');
  if (shape && !onBound.has('p') && (!shape.ci95 || shape.ci95[1] / shape.ci95[0] > 10)) {
    warnings.push('The Pella-Tomlinson shape p is poorly determined by these data (95% interval spans more than a factor of 10): consider fixing p.');
  }

  const fixedNames = [...(['r', 'K', 'd0'] as const).filter((n) => !problem.bounds.some((b) => b.name === n)).map((n) => (n === 'd0' ? 'B0/K' : n)),
    ...Object.keys(problem.fixedQ).map((ix) => `q (${ix})`)];
  for (const e of estimates) if (fixedNames.includes(e.name)) { e.se = null; e.ci95 = null; }
  const logPrior = -problem.penalty(u);
  const indices = series.indices.map((ix) => {
    const f = concentratedIndexFit(ix.values, biomass, ix.cv, problem.fixedQ[ix.name])!;
    return { name: ix.name, q: f.q, sigma: f.sigma, residuals: f.residuals, fitted: series.years.map((_, t) => f.q * biomass[t]!) };
  });
  const nParams = problem.bounds.length + 2 * series.indices.length - Object.keys(problem.fixedQ).length;
  const dataNll = fit.nll + logPrior;
  const n = problem.nObs;
  const aic = 2 * nParams + 2 * dataNll;
  const last = problem.catches.length - 1;
  return {
    model: problem.model, fixed: fixedNames, penalised: logPrior !== 0, logPrior, constraints,
    years: series.years, params: { ...params, p: params.p ?? 1 }, free: u, estimates,
    logLik: -dataNll, aic, aicc: n - nParams - 1 > 0 ? aic + (2 * nParams * (nParams + 1)) / (n - nParams - 1) : Infinity,
    nParams, nObs: n, indices, biomass, catches: problem.catches, filledCatchYears: problem.filledYears,
    reference: ref, hStar: foldHarvestOf(fit, u),
    status: {
      year: series.years[last]!,
      bOverBmsy: biomass[last + 1]! / ref.bMsy,
      fOverFmsy: problem.catches[last]! / Math.max(biomass[last]!, 1e-12) / ref.fMsy,
    },
    convergence: {
      converged: warnings.every((w) => !/not converged|iteration limit|not identifiable/.test(w)),
      iterations: fit.iterations, evaluations: fit.evaluations, simplexSize: fit.simplexSize, gradientNorm,
      startsRun: fit.startValues.length, startsAgreeing: agreeing, warnings,
    },
  };
}
