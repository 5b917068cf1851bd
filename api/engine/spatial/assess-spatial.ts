/** Entry point for spatial stocks: every reserve design's equilibrium map and figures, side by side. */
import { GROWTH, type SpatialGrowthName, type SpatialParams } from './growth';
import { areas, coastHabitat, habitatFromMask, type Habitat, type MaskCode } from './habitat';
import { integrateRd, totalStock } from './reaction-diffusion';
import { evaluateDesign, fishingSweep, type FishingSweep } from './reserve';
import { recoveryFront, type RecoveryFront } from './front';

export type SpatialHabitatSpec = { kind: 'coast'; length: number; cells: number } | { kind: 'grid'; cellKm: number };
export type DesignSpec = { name: string; reserves?: [number, number][]; mask?: MaskCode[][] };

export interface SpatialStudyOptions {
  growth: SpatialGrowthName;
  params: SpatialParams;
  /** Fishing mortality outside reserves (1/yr). */
  fishing: number;
  habitat: SpatialHabitatSpec;
  designs: DesignSpec[];
  onProgress?: (fraction: number, stage: string) => void;
}

export interface DesignSummary {
  name: string;
  nx: number;
  ny: number;
  /** Cell width (km). */
  h: number;
  /** Full-grid index of each habitable cell; density and reserve follow this order. */
  cells: number[];
  reserve: number[];
  density: number[];
  reserveArea: number;
  reserveShare: number;
  reserveCount: number;
  /** Mean distance between neighbouring reserves (km), null with fewer than two. */
  spacing: number | null;
  total: number;
  yield: number;
  spillover: number;
  persists: boolean;
  sparseGrowthRate: number;
  sweep: FishingSweep;
  front: RecoveryFront | null;
  /** Years from a collapse to 90% of the unfished equilibrium with the fishery closed. */
  recoveryYears: number | null;
}

export interface SpatialStudy {
  kind: 'spatial';
  growth: SpatialGrowthName;
  params: SpatialParams;
  fishing: number;
  areaUnit: 'km' | 'km²';
  designs: DesignSummary[];
}

function habitatFor(o: SpatialStudyOptions, d: DesignSpec): Habitat {
  if (o.habitat.kind === 'coast') return coastHabitat(o.habitat.length, o.habitat.cells, d.reserves ?? []);
  if (!d.mask) throw new Error(`design "${d.name}" has no mask`);
  return habitatFromMask(d.mask, o.habitat.cellKm);
}

/** Groups of reserve cells joined through shared faces, with their centroids (km). */
function reserveGroups(hab: Habitat): { x: number; y: number }[] {
  const n = hab.cells.length;
  const seen = new Uint8Array(n);
  const adj: number[][] = Array.from({ length: n }, () => []);
  for (let e = 0; e < hab.faces.length; e += 2) { adj[hab.faces[e]!]!.push(hab.faces[e + 1]!); adj[hab.faces[e + 1]!]!.push(hab.faces[e]!); }
  const out: { x: number; y: number }[] = [];
  for (let s = 0; s < n; s++) {
    if (!hab.reserve[s] || seen[s]) continue;
    const stack = [s];
    seen[s] = 1;
    let sx = 0, sy = 0, k = 0;
    while (stack.length) {
      const i = stack.pop()!;
      const g = hab.cells[i]!;
      sx += (g % hab.nx) + 0.5; sy += Math.floor(g / hab.nx) + 0.5; k++;
      for (const j of adj[i]!) if (hab.reserve[j] && !seen[j]) { seen[j] = 1; stack.push(j); }
    }
    out.push({ x: (sx / k) * hab.h, y: (sy / k) * hab.h });
  }
  return out;
}

function spacingOf(groups: { x: number; y: number }[]): number | null {
  if (groups.length < 2) return null;
  const nearest = groups.map((g, i) => Math.min(...groups.filter((_, j) => j !== i).map((o) => Math.hypot(o.x - g.x, o.y - g.y))));
  return nearest.reduce((a, b) => a + b, 0) / nearest.length;
}

/** Evaluates each design at the given fishing mortality, sweeps fishing to the loss of the stock, and times recovery. */
export function spatialStudy(o: SpatialStudyOptions): SpatialStudy {
  const growth = GROWTH[o.growth];
  const designs: DesignSummary[] = o.designs.map((d, k) => {
    const step = (f: number, stage: string) => o.onProgress?.((k + f) / o.designs.length * 0.98, `${d.name}: ${stage}`);
    const hab = habitatFor(o, d);
    step(0, 'equilibrium');
    const res = evaluateDesign(hab, growth, o.params, o.fishing);
    step(0.2, 'fishing sweep');
    const sweep = fishingSweep(hab, growth, o.params, Math.max(2 * o.params.r, 2 * o.fishing), 20);
    step(0.6, 'recovery');
    const unfished = totalStock(hab, evaluateDesign(hab, growth, o.params, 0).density);
    const hasReserve = hab.reserve.some((v) => v === 1);
    let front: RecoveryFront | null = null;
    let recoveryYears: number | null = null;
    const horizon = 60 / o.params.r;
    if (hasReserve && hab.ny === 1) {
      front = recoveryFront(hab, growth, o.params, { F: 0, years: horizon, dt: Math.min(0.05, 0.1 / o.params.r), target: unfished });
      recoveryYears = front.yearsTo90;
    } else if (hasReserve) {
      const u0 = Array.from(hab.reserve, (v) => (v ? o.params.K : 0));
      integrateRd({ hab, growth, params: o.params, F: 0 }, u0, horizon, {
        dt: Math.min(0.1, 0.2 / o.params.r), refreshEvery: 10,
        onStep: (t, u) => { if (totalStock(hab, u) >= 0.9 * unfished) { recoveryYears = t; return false; } return true; },
      });
    }
    const groups = reserveGroups(hab);
    const a = areas(hab);
    return {
      name: d.name, nx: hab.nx, ny: hab.ny, h: hab.h, cells: Array.from(hab.cells), reserve: Array.from(hab.reserve), density: res.density,
      reserveArea: a.reserve, reserveShare: a.reserve / a.total, reserveCount: groups.length, spacing: spacingOf(groups),
      total: res.total, yield: res.yield, spillover: res.spillover, persists: res.persists, sparseGrowthRate: res.sparseGrowthRate,
      sweep, front, recoveryYears,
    };
  });
  o.onProgress?.(0.99, 'Done');
  return { kind: 'spatial', growth: o.growth, params: o.params, fishing: o.fishing, areaUnit: o.habitat.kind === 'coast' ? 'km' : 'km²', designs };
}

