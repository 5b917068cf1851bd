/**
 * Invented spawner/recruit series for a discrete-generation stock (Ricker r = 2.6, K = 5,000 t,
 * lognormal process error sd 0.2, harvest rates that rise, overshoot and are cut back), seed 2026.
 * `node --import tsx seeders/stock-recruit-series.ts` rewrites seeders/data/ricker-demo-sr.csv.
 */
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { createRng } from '../api/engine/numerics/random';
import { ricker } from '../api/engine/discrete/ricker';

export const SR_TRUTH = { r: 2.6, K: 5000, sd: 0.2, seed: 2026 };

/** CSV text: year, spawners, recruits, catch (recruits of a row come from that row's spawners). */
export function stockRecruitCsv(): string {
  const rng = createRng(SR_TRUTH.seed);
  const lines = ['year,spawners,recruits,catch'];
  let N = 0.8 * SR_TRUTH.K;
  for (let i = 0; i < 32; i++) {
    const u = Math.min(0.8, 0.25 + 0.02 * i + (i > 20 ? -0.25 : 0) + 0.05 * rng.uniform());
    const S = (1 - u) * N;
    const R = ricker.recruits(S, SR_TRUTH) * Math.exp(SR_TRUTH.sd * rng.normal());
    lines.push(`${1990 + i},${S.toFixed(1)},${R.toFixed(1)},${(u * N).toFixed(1)}`);
    N = R;
  }
  return lines.join('\n') + '\n';
}

if (import.meta.url === `file://${process.argv[1]}`) {
  writeFileSync(join(import.meta.dirname, 'data', 'ricker-demo-sr.csv'), stockRecruitCsv());
  console.log('wrote seeders/data/ricker-demo-sr.csv');
}
