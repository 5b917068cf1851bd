/** The reserve design a proposal carries: copied from a finished reserve study of the same stock when the proposal is drafted. */
import { HttpError, NotFoundError } from '../http/http-error';
import { Run } from '../runs/run.model';
import type { SpatialRunResults } from '../runs/run.schemas';
import type { ReserveDesignFigures } from './proposal.schemas';

/** Figures of design `index` of reserve-study run `runId`; the run must belong to the stock and have finished. */
export async function reserveDesignFigures(stockId: number, ref: { runId: number; index: number }): Promise<ReserveDesignFigures> {
  const run = await Run.findByPk(ref.runId);
  if (!run || run.stockId !== stockId) throw new NotFoundError('Reserve study run');
  const res = run.results ? (JSON.parse(run.results) as SpatialRunResults) : null;
  if (run.status !== 'succeeded' || res?.kind !== 'spatial') throw new HttpError(422, 'RUN_NOT_RESERVE_STUDY', 'The reserve design must come from a finished reaction-diffusion (reserve study) run of this stock.');
  const d = res.designs[ref.index];
  if (!d) throw new HttpError(422, 'DESIGN_NOT_FOUND', `That reserve study has ${res.designs.length} design(s); there is no design ${ref.index + 1}.`, { 'reserveDesign.index': ['No such design in the run.'] });
  return {
    runId: run.id, name: d.name, growth: res.growth, params: res.params, fishing: res.fishing, areaUnit: res.areaUnit,
    nx: d.nx, ny: d.ny, h: d.h, cells: d.cells, reserve: d.reserve, density: d.density,
    reserveArea: d.reserveArea, reserveShare: d.reserveShare, reserveCount: d.reserveCount, total: d.total, yield: d.yield, spillover: d.spillover,
    persists: d.persists, criticalF: d.sweep.criticalF, lossKind: d.sweep.kind, recoveryYears: d.recoveryYears, frontSpeed: d.front?.speed ?? null,
  };
}
