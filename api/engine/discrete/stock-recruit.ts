/**
 * Discrete-generation stock-recruitment models and the harvest convention shared by all of them.
 *
 * Convention: the harvest rate u is taken before spawning. A year starts with the stock N (the
 * recruits of last year's spawning); the catch is u·N; the escapement S = (1 − u)·N spawns; next
 * year's stock is the recruitment f(S). So N' = f((1 − u)·N).
 */
import { ricker } from './ricker';
import { bevertonHolt } from './beverton-holt';
import { logisticMap } from './logistic-map';

export type DiscreteParams = Record<string, number>;

export interface DiscreteParamSpec {
  name: string;
  label: string;
  lower: number;
  upper: number;
}

/** Equilibrium reference points under a constant harvest rate before spawning. */
export interface DiscreteReference {
  /** Escapement (spawners) at MSY. */
  sMsy: number;
  /** Stock before harvest (recruits) at MSY. */
  nMsy: number;
  msy: number;
  /** Harvest rate at MSY, as a fraction of the stock before harvest. */
  uMsy: number;
  /** Unfished equilibrium. */
  n0: number;
  /** Harvest rate at and above which the stock declines to zero from any size. */
  uCollapse: number;
}

export interface DiscreteModel {
  name: DiscreteModelName;
  label: string;
  params: readonly DiscreteParamSpec[];
  /** The parameter that sets productivity (the control of the cascade "against productivity"). */
  productivity: string;
  /** The parameter that sets the scale of the stock (carrying capacity). */
  scale: string;
  /** Recruits from spawners S ≥ 0 (never negative). */
  recruits(S: number, p: DiscreteParams): number;
  /** d recruits / dS. */
  slope(S: number, p: DiscreteParams): number;
  /** Reference points in closed form. */
  reference(p: DiscreteParams): DiscreteReference;
  /** Starting values for a fit to spawner/recruit pairs. */
  start(S: number[], R: number[]): DiscreteParams;
}

export type DiscreteModelName = 'ricker' | 'beverton-holt' | 'logistic-map';

/** The registry: adding a model is one file and one line here. */
export const DISCRETE_MODELS: Record<DiscreteModelName, DiscreteModel> = {
  ricker,
  'beverton-holt': bevertonHolt,
  'logistic-map': logisticMap,
};

export function discreteModel(name: string): DiscreteModel {
  const m = (DISCRETE_MODELS as Record<string, DiscreteModel | undefined>)[name];
  if (!m) throw new Error(`unknown stock-recruitment model "${name}" (known: ${Object.keys(DISCRETE_MODELS).join(', ')})`);
  return m;
}

/** Checks that every parameter is present, finite and inside its bounds. */
export function checkParams(model: DiscreteModel, p: DiscreteParams): string[] {
  const out: string[] = [];
  for (const s of model.params) {
    const v = p[s.name];
    if (v === undefined) out.push(`${s.name} is missing`);
    else if (!Number.isFinite(v) || v < s.lower || v > s.upper) out.push(`${s.name} must lie in [${s.lower}, ${s.upper}], not ${v}`);
  }
  for (const k of Object.keys(p)) if (!model.params.some((s) => s.name === k)) out.push(`${model.name} has no parameter ${k}`);
  return out;
}

/** One year of the harvested map N → f((1 − u)N). */
export function nextStock(model: DiscreteModel, p: DiscreteParams, u: number, N: number): number {
  return model.recruits((1 - u) * N, p);
}

/** Derivative of the harvested map with respect to N. */
export function nextStockSlope(model: DiscreteModel, p: DiscreteParams, u: number, N: number): number {
  return (1 - u) * model.slope((1 - u) * N, p);
}
