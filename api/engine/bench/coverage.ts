/** npm run coverage: the interval-coverage study as a table (like the benchmark, not a test). Usage: npm run coverage [-- N]. */
import { coverageStudy, STUDY_TRUTH } from '../uncertainty/coverage-study';

const n = Number(process.argv[2] ?? 100);
const seed = 20261203;
console.log(`Coverage of 95% profile-likelihood intervals, ${n} data sets per row: Schaefer truth r = ${STUDY_TRUTH.r}, K = ${STUDY_TRUTH.K}, B0/K = ${STUDY_TRUTH.d0}, ${STUDY_TRUTH.years} years, survey σ_obs = ${STUDY_TRUTH.sdObs}.`);
console.log('Target: 93–97%. "low"/"high": misses with the interval entirely below/above the truth.\n');
const head = ['truth', 'error model', 'r', 'K', 'MSY', 'h*', 'seconds'];
const rows: string[][] = [];
for (const sdProc of [0, 0.1]) {
  for (const errors of ['observation', 'state-space'] as const) {
    const t0 = performance.now();
    const res = coverageStudy({ ...STUDY_TRUTH, sdProc }, n, seed, errors);
    rows.push([sdProc === 0 ? 'deterministic' : `process σ_p = ${sdProc}`, errors,
      ...res.map((r) => `${((100 * r.covered) / r.total).toFixed(0)}% (low ${r.below}, high ${r.above})`), ((performance.now() - t0) / 1000).toFixed(1)]);
  }
}
const w = head.map((h, i) => Math.max(h.length, ...rows.map((r) => r[i]!.length)));
console.log(head.map((h, i) => h.padEnd(w[i]!)).join('  '));
console.log(w.map((x) => '-'.repeat(x)).join('  '));
for (const r of rows) console.log(r.map((c, i) => c.padEnd(w[i]!)).join('  '));
