/**
 * The harvest diagram of a surplus-production model: equilibria under a constant catch and under a
 * constant F, every fold and transcritical point, and the fold harvest h* at which the stable state
 * reached from the unfished stock disappears. For the concave models h* equals MSY (Clark 1990); with
 * depensation it does not.
 */
import { productionModel, type SurplusModelName } from './registry';
import type { SurplusParams } from './production-model';
import { analyseEquilibria, stateAtControl, type EquilibriumAnalysis } from './equilibria';

export interface FoldPoint {
  h: number;
  /** Stable equilibrium (upper branch) at this harvest. */
  stable: number;
  /** Unstable threshold below it at this harvest (0 when the only lower equilibrium is extinction). */
  unstable: number;
  /** −d(g − h)/dB at the stable equilibrium: 0 at the fold. */
  returnRate: number;
}

export interface FoldAnalysis {
  hStar: number;
  /** Biomass at the fold. */
  bFold: number;
  /** The upper branch and the threshold on a common grid of catches from 0 to h*. */
  table: FoldPoint[];
  /** The full analysis under a constant catch and under a constant F (absent in runs stored before they existed). */
  catch?: EquilibriumAnalysis;
  F?: EquilibriumAnalysis;
}

/** Both controls analysed, and the table of the upper branch under a catch up to h*. */
export function surplusFold(model: SurplusModelName, params: SurplusParams, gridSize = 80): FoldAnalysis {
  const m = productionModel(model);
  const catchAnalysis = analyseEquilibria(m, params, 'catch');
  const fAnalysis = analyseEquilibria(m, params, 'F');
  const collapse = catchAnalysis.collapse;
  if (!collapse) throw new Error('the stock has no positive equilibrium even unfished');
  const hStar = collapse.at;
  const bFold = collapse.biomass;
  const table: FoldPoint[] = [];
  for (let i = 0; i <= gridSize; i++) {
    const h = (hStar * i) / gridSize;
    if (i === gridSize) {
      table.push({ h, stable: bFold, unstable: bFold, returnRate: 0 });
      continue;
    }
    const s = stateAtControl(m, params, 'catch', h);
    table.push({ h, stable: s.stable ?? bFold, unstable: s.threshold ?? 0, returnRate: s.returnRate });
  }
  return { hStar, bFold, table, catch: catchAnalysis, F: fAnalysis };
}

/** Both equilibria and the return rate at one harvest; null past the fold. */
export function equilibriaAt(model: SurplusModelName, params: SurplusParams, fold: Pick<FoldAnalysis, 'hStar'>, h: number): FoldPoint | null {
  if (h > fold.hStar) return null;
  const s = stateAtControl(productionModel(model), params, 'catch', Math.max(h, 0));
  if (s.stable === null) return null;
  return { h, stable: s.stable, unstable: s.threshold ?? 0, returnRate: s.returnRate };
}
