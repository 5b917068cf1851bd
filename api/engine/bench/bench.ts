/** npm run bench: timings of the engine's hot paths, printed as a table (not a test). */
import { bootstrapFit } from '../assessment';
import { fitSurplusRaw, surplusProblem } from '../surplus/fit-surplus';
import { summariseFit } from '../fit/fit-summary';
import { fitPredatorPrey } from '../linked/fit-predator-prey';
import { SINGLE_STOCKS, SPRAT_COD_TRUTH, demoSeries, simulateSingle } from '../../../seeders/series-generator';

function time<T>(f: () => T, minMs = 400): { ms: number; runs: number; last: T } {
  let last = f();
  const t0 = performance.now();
  let runs = 0;
  while (performance.now() - t0 < minMs) { last = f(); runs++; }
  return { ms: (performance.now() - t0) / runs, runs, last };
}

const crab = SINGLE_STOCKS.find((s) => s.code === 'blue-lip-crab')!;
const sim = simulateSingle(crab, 7, 40);
const series = { years: sim.years, catches: sim.catches, indices: [{ name: 'trap_survey', values: sim.index, cv: null }] };
const rows: [string, string, string][] = [];

const problem = surplusProblem(series, { model: 'schaefer' });
const u = fitSurplusRaw(series, { model: 'schaefer' }).u;
const lik = time(() => problem.nll(u));
rows.push(['one likelihood evaluation (Schaefer, 40 years)', `${(lik.ms * 1000).toFixed(2)} µs`, '—']);

const fit = time(() => fitSurplusRaw(series, { model: 'schaefer' }), 1500);
rows.push(['one Schaefer fit, 40 years (3 starts + polish)', `${fit.ms.toFixed(1)} ms`, '< 50 ms']);

const summary = summariseFit(series, fit.last);
const t0 = performance.now();
await bootstrapFit(series, { model: 'schaefer' }, summary, { replicates: 1000, seed: 1, workers: 2 });
rows.push(['1,000 bootstrap refits on 2 worker threads', `${((performance.now() - t0) / 1000).toFixed(2)} s`, '< 3 s']);

const pt = SINGLE_STOCKS.find((s) => s.code === 'silver-smelt')!;
const ptSim = simulateSingle(pt, 7, 40);
const ptSeries = { years: ptSim.years, catches: ptSim.catches, indices: [{ name: 'acoustic', values: ptSim.index, cv: null }] };
// side by side on the same 40-year series: the Taylor path against the Schaefer closed form
const sFit = time(() => fitSurplusRaw(ptSeries, { model: 'schaefer' }), 1500);
const ptFit = time(() => fitSurplusRaw(ptSeries, { model: 'pella-tomlinson', shape: 0.6 }), 1500);
const foxFit = time(() => fitSurplusRaw(ptSeries, { model: 'fox' }), 1500);
rows.push(['Schaefer fit, same 40 years as the two below', `${sFit.ms.toFixed(1)} ms`, '—']);
rows.push(['Pella-Tomlinson fit (p fixed, Taylor path), 40 years', `${ptFit.ms.toFixed(1)} ms`, '—']);
rows.push(['  ratio to Schaefer', `${(ptFit.ms / sFit.ms).toFixed(2)}×`, '≤ 3×']);
rows.push(['Fox fit (Taylor path), 40 years', `${foxFit.ms.toFixed(1)} ms`, '—']);
rows.push(['  ratio to Schaefer', `${(foxFit.ms / sFit.ms).toFixed(2)}×`, '≤ 3×']);

const ptSummary = summariseFit(ptSeries, ptFit.last);
const t1 = performance.now();
await bootstrapFit(ptSeries, { model: 'pella-tomlinson', shape: 0.6 }, ptSummary, { replicates: 1000, seed: 1, workers: 2 });
rows.push(['1,000 Pella-Tomlinson bootstrap refits on 2 worker threads', `${((performance.now() - t1) / 1000).toFixed(2)} s`, '< 10 s']);

const linked = demoSeries()[SPRAT_COD_TRUTH.code]!;
const t2 = performance.now();
fitPredatorPrey(linked, { model: 'rosenzweig-macarthur' });
rows.push(['one Rosenzweig-MacArthur fit to the sprat and cod surveys', `${((performance.now() - t2) / 1000).toFixed(2)} s`, '< 1 s']);

const w = [Math.max(...rows.map((r) => r[0].length)), 12, 9];
console.log(`${'measure'.padEnd(w[0])}  ${'time'.padStart(w[1])}  ${'aim'.padStart(w[2])}`);
console.log(`${'-'.repeat(w[0])}  ${'-'.repeat(w[1])}  ${'-'.repeat(w[2])}`);
for (const r of rows) console.log(`${r[0].padEnd(w[0])}  ${r[1].padStart(w[1])}  ${r[2].padStart(w[2])}`);
