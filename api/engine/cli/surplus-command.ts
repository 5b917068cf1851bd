/** The single-stock harvest diagram from given parameters (cli fold --params), and the summary both fold forms print. */
import { surplusFold, type FoldAnalysis } from '../surplus/fold';
import { productionModel, type SurplusModelName } from '../surplus/registry';
import type { SurplusParams } from '../surplus/production-model';
import type { Bifurcation, EquilibriumAnalysis } from '../surplus/equilibria';
import { parseParamList, UsageError } from './command-args';

/** What `fold` prints for a harvest diagram: every bifurcation under a catch and under F, and the catch table. */
export function foldReport(fold: FoldAnalysis) {
  const side = (a: EquilibriumAnalysis | undefined) => a && {
    collapse: a.collapse, recovery: a.recovery, lowerState: a.lower, hysteresis: a.hysteresis, recoveryNote: a.recoveryNote, unfished: a.unfished,
  };
  const bifurcations: Bifurcation[] = [...(fold.catch?.bifurcations ?? []), ...(fold.F?.bifurcations ?? [])];
  return {
    hStar: fold.hStar, bFold: fold.bFold,
    bifurcations: bifurcations.map((b) => ({ kind: b.kind, control: b.control, at: b.at, biomass: b.biomass })),
    catch: side(fold.catch), F: side(fold.F),
    noFold: { catch: !fold.catch?.bifurcations.some((b) => b.kind === 'fold'), F: !fold.F?.bifurcations.some((b) => b.kind === 'fold') },
    table: fold.table,
  };
}

/** Parameters for a model from "r=0.5,K=1000,A=100": checks names and ranges, names what is missing. */
export function paramsFor(model: SurplusModelName, text: string | undefined): SurplusParams {
  const given = parseParamList(text, 'params');
  const m = productionModel(model);
  const allowed = ['r', 'K', ...m.shape.map((s) => s.name)];
  for (const k of Object.keys(given)) if (!allowed.includes(k)) throw new UsageError(`--params: ${model} takes ${allowed.join(', ')}, not "${k}"`);
  for (const k of allowed) if (given[k] === undefined && !(k === 'p')) throw new UsageError(`--params: ${model} needs ${allowed.join(', ')} (missing ${k})`);
  for (const k of allowed) if (given[k] !== undefined && !(given[k]! > 0)) throw new UsageError(`--params: ${k} must be above zero`);
  if (model === 'allee' && !(given.A! < given.K!)) throw new UsageError('--params: the Allee threshold A must lie below K');
  return { ...given, r: given.r!, K: given.K! };
}

/** cli fold --model M --params ...: the diagram without data. */
export function foldFromParams(model: SurplusModelName, text: string | undefined) {
  const params = paramsFor(model, text);
  return { model, params, ...foldReport(surplusFold(model, params)) };
}
