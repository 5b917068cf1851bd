import { sampleCorrelation, sampleVariance } from 'simple-statistics';
import { createRng } from '../numerics/random';
import { detrendLinear, earlyWarning, kendallTauB, lag1Autocorrelation, variance } from './early-warning';

// Check values: ../shared/check-values.md (Scheffer et al. 2009, Nature 461:53; Dakos et al. 2012,
// PLoS ONE 7:e41010); cross-checked against simple-statistics, a general-purpose npm library.
describe('early-warning indicators', () => {
  const s = [2, 4, 3, 5, 4, 7, 5, 8, 4, 9, 3, 10];

  it('match the published lag-1 autocorrelation, variance and Kendall tau-b', () => {
    expect(lag1Autocorrelation(s)).toBeCloseTo(-0.39259, 5);
    expect(variance(s)).toBeCloseTo(6.606061, 6);
    expect(kendallTauB(s.map((_, i) => i), s)).toBeCloseTo(0.488568, 6);
  });

  it('agree with simple-statistics for variance and Pearson correlation', () => {
    expect(variance(s)).toBeCloseTo(sampleVariance(s), 12);
    expect(lag1Autocorrelation(s)).toBeCloseTo(sampleCorrelation(s.slice(0, -1), s.slice(1)), 12);
  });

  it('detrending removes a straight line exactly', () => {
    expect(detrendLinear([3, 5, 7, 9, 11]).every((v) => Math.abs(v) < 1e-12)).toBeTrue();
  });

  it('shows rising variance and autocorrelation as a stock slows towards a fold (positive tau)', () => {
    // AR(1) whose coefficient rises from 0.1 to 0.95: the linear-noise picture near a fold
    const rng = createRng(42);
    let x = 0;
    const series = Array.from({ length: 200 }, (_, t) => (x = ((0.95 * t) / 199) * x + rng.normal()));
    const ew = earlyWarning(series.map((_, i) => 1800 + i), series);
    expect(ew.window).toBe(100);
    expect(ew.tauAutocorrelation).toBeGreaterThan(0.5);
    expect(ew.tauVariance).toBeGreaterThan(0.5);
  });
});
