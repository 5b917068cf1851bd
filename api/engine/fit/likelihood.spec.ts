import { concentratedIndexFit, lognormalNll } from './likelihood';

// Polacheck, Hilborn & Punt (1993) CJFAS 50:2597: q̂ = exp(mean ln(I/B)), σ̂² = mean residual².
describe('concentrated lognormal likelihood', () => {
  const biomass = [1000, 900, 820, 760, 700, 690, 720, 760, 800, 830];
  const index = biomass.map((b, i) => 0.002 * b * Math.exp(0.15 * Math.sin(1.7 * i + 0.3)));

  it('gives the q and σ that a brute-force search of the full likelihood finds', () => {
    const fit = concentratedIndexFit(index, biomass)!;
    let best = { q: 0, s: 0, f: Infinity };
    for (let lq = Math.log(0.0015); lq < Math.log(0.0025); lq += 1e-4) {
      for (let s = 0.02; s < 0.3; s += 5e-4) {
        const f = lognormalNll(index, biomass, Math.exp(lq), s);
        if (f < best.f) best = { q: Math.exp(lq), s, f };
      }
    }
    expect(Math.abs(best.q / fit.q - 1)).toBeLessThan(2e-4);
    expect(Math.abs(best.s - fit.sigma)).toBeLessThan(1e-3);
    expect(fit.nll).toBeLessThanOrEqual(best.f + 1e-9);
    expect(fit.nll).toBeCloseTo(lognormalNll(index, biomass, fit.q, fit.sigma), 10);
  });

  it('skips missing years and leaves their residual empty', () => {
    const gappy = index.map((v, i) => (i === 3 ? null : v));
    const fit = concentratedIndexFit(gappy, biomass)!;
    expect(fit.n).toBe(9);
    expect(fit.residuals[3]).toBeNull();
    expect(fit.residuals.filter((r) => r !== null).reduce((s, r) => s + r!, 0)).toBeCloseTo(0, 12);
  });

  it('with CVs weights each year by 1/σ_t² where σ_t = √ln(1 + CV²)', () => {
    const cv = index.map((_, i) => (i < 5 ? 0.1 : 0.4));
    const fit = concentratedIndexFit(index, biomass, cv)!;
    const z = index.map((v, i) => Math.log(v / biomass[i]!));
    const w = cv.map((c) => 1 / Math.log(1 + c * c));
    const lnq = z.reduce((s, v, i) => s + w[i]! * v, 0) / w.reduce((s, v) => s + v, 0);
    expect(Math.log(fit.q)).toBeCloseTo(lnq, 12);
  });
});
