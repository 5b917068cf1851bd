import { logisticFold, logisticHarvest } from './logistic-harvest';
import { integrate } from '../numerics/ode';
import { biomassPath } from './surplus';

// Check values: ../shared/check-values.md (computed with an independent numerical library);
// formulas from Clark (1990) Mathematical Bioeconomics, 2nd ed., ch. 1, and May (1977) Nature 269:471.
describe('logistic growth with constant harvest', () => {
  const r = 0.4, K = 1000;

  it('has its fold at h* = rK/4 with N± = (K/2)(1 ± √(1 − h/h*)) and λ = r√(1 − h/h*)', () => {
    const f = logisticFold(r, K, 80);
    expect(f.hStar).toBe(100);
    expect(f.stable!).toBeCloseTo(723.606798, 6);
    expect(f.unstable!).toBeCloseTo(276.393202, 6);
    // Wissel (1984) Oecologia 65:101: return rate r√(1 − h/h*)
    expect(f.returnRate).toBeCloseTo(0.178885, 6);
  });

  it('has no equilibrium past the fold and a return rate of zero there', () => {
    const f = logisticFold(r, K, 100.0001);
    expect(f.stable).toBeNull();
    expect(f.unstable).toBeNull();
    expect(logisticFold(r, K, 100).returnRate).toBe(0);
  });

  it('marks N+ stable and N− unstable by the sign of the linearisation g\'(N) = r(1 − 2N/K)', () => {
    const f = logisticFold(r, K, 80);
    expect(r * (1 - (2 * f.stable!) / K)).toBeLessThan(0);
    expect(r * (1 - (2 * f.unstable!) / K)).toBeGreaterThan(0);
  });

  it('reproduces the published trajectory from N0 = 1000 under h = 80', () => {
    expect(logisticHarvest(r, K, 80, 1000, 1).N).toBeCloseTo(933.481, 3);
    expect(logisticHarvest(r, K, 80, 1000, 5).N).toBeCloseTo(806.370, 3);
    expect(logisticHarvest(r, K, 80, 1000, 10).N).toBeCloseTo(754.107, 3);
    expect(logisticHarvest(r, K, 80, 1000, 20).N).toBeCloseTo(728.431, 3);
  });

  it('collapses from below the threshold at the published time, and at h = h* follows K/2 + u0/(1 + r·t·u0/K)', () => {
    expect(logisticHarvest(r, K, 80, 200, 5).N).toBeCloseTo(28.2504, 4);
    const c = logisticHarvest(r, K, 80, 200, 6);
    expect(c.N).toBe(0);
    expect(c.collapseTime!).toBeCloseTo(5.38011, 5);
    expect(logisticHarvest(r, K, 100, 1000, 10).N).toBeCloseTo(666.667, 3);
  });

  it('agrees with the odex path of the same ODE to 1e-8 (relative), below, at and above the fold', () => {
    for (const [h, N0, t] of [[80, 1000, 20], [80, 450, 7], [100, 900, 10], [0, 10, 10], [30, 120, 15], [120, 1000, 3]] as const) {
      const exact = logisticHarvest(r, K, h, N0, t).N;
      const ode = integrate((_t, y) => [r * y[0]! * (1 - y[0]! / K) - h], 0, [N0], t, { tol: 1e-12 }).y[0]!;
      expect(Math.abs(ode - exact) / exact).withContext(`h=${h} N0=${N0} t=${t}`).toBeLessThan(1e-8);
    }
  });

  it('gives the same annual biomass path whether stepped exactly or integrated with odex', () => {
    const catches = [50, 80, 120, 90, 60, 110, 95, 70];
    const a = biomassPath('schaefer', { r, K }, 900, catches).biomass;
    const b = biomassPath('schaefer', { r, K }, 900, catches, { forceOdex: true, tol: 1e-12 }).biomass;
    a.forEach((v, i) => expect(Math.abs(v - b[i]!) / v).toBeLessThan(1e-8));
  });

  it('treats a path through zero as a collapse: zeros, never negative or NaN', () => {
    const tc = logisticHarvest(r, K, 200, 300, 10).collapseTime!;
    expect(tc).toBeGreaterThan(2);
    expect(tc).toBeLessThan(3);
    const exact = biomassPath('schaefer', { r, K }, 300, [200, 200, 200, 200, 200]);
    const ode = biomassPath('schaefer', { r, K }, 300, [200, 200, 200, 200, 200], { forceOdex: true });
    for (const p of [exact, ode]) {
      expect(p.collapseYear).toBe(Math.floor(tc));
      expect(p.biomass.every((v) => Number.isFinite(v) && v >= 0)).toBeTrue();
      expect(p.biomass.slice(3)).toEqual([0, 0, 0]);
    }
  });
});
