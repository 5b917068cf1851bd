import { coverageStudy, STUDY_TRUTH } from './coverage-study';

// Coverage of 95% profile-likelihood intervals (Venzon & Moolgavkar 1988; small-sample threshold
// after Cox & Hinkley 1974, §7.5): from a known Schaefer truth (deterministic dynamics, lognormal
// survey error σ = 0.2, 40 years), at least 17 of 20 seeded data sets must contain the truth for
// each of r, K, MSY and h*. With a true coverage of 95% the chance of 16 or fewer is about 1.6%
// (binomial); the seed makes the outcome fixed.
describe('interval coverage on simulated data', () => {
  it('contains the true r, K, MSY and h* in at least 17 of 20 seeded data sets', () => {
    const rows = coverageStudy({ ...STUDY_TRUTH, sdProc: 0 }, 20, 20261203);
    for (const row of rows) {
      expect(row.total).toBe(20);
      expect(row.covered).withContext(`${row.quantity}: ${row.covered}/20 (below ${row.below}, above ${row.above})`).toBeGreaterThanOrEqual(17);
    }
  });
});
