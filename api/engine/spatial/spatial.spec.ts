import { integrate } from '../numerics/ode';
import { createRng } from '../numerics/random';
import { GROWTH } from './growth';
import { coastHabitat, habitatFromMask, type MaskCode } from './habitat';
import { integrateRd, principalRate, rhs, totalStock } from './reaction-diffusion';
import { criticalLength, evaluateDesign, fishingSweep } from './reserve';
import { recoveryFront } from './front';

const logistic = GROWTH.logistic;

describe('spatial model: method of lines', () => {
  it('matches odex on a small coast (ROS2 against Gragg-Bulirsch-Stoer extrapolation)', () => {
    const hab = coastHabitat(20, 30, [[8, 12]]);
    const pb = { hab, growth: logistic, params: { r: 0.8, K: 50, D: 1.5 }, F: 0.6 };
    const init = Array.from({ length: 30 }, (_, i) => 10 + 20 * Math.sin(i / 3) ** 2);
    const ours = integrateRd(pb, init, 5, { dt: 0.005 });
    const ref = integrate((_t, y) => Array.from(rhs(pb, y)), 0, init, 5, { tol: 1e-10, maxSteps: 100_000 });
    for (let i = 0; i < 30; i++) expect(Math.abs(ours[i]! - ref.y[i]!)).toBeLessThan(1e-4);
  });

  it('matches the heat equation\'s Fourier series on a coast with lethal ends within 1%', () => {
    // u_t = D u_xx, u(0) = u(L) = 0, u(x, 0) = x(L − x): u = Σ_odd 8L²/(k³π³) sin(kπx/L) e^(−Dk²π²t/L²)
    // (Carslaw & Jaeger 1959, §3.3)
    const L = 10, D = 0.7, n = 200, T = 3;
    const hab = coastHabitat(L, n, [[0, L]], 'lethal');
    const xs = Array.from({ length: n }, (_, i) => ((i + 0.5) * L) / n);
    const u = integrateRd({ hab, growth: logistic, params: { r: 0, K: 1, D }, F: 0 }, xs.map((x) => x * (L - x)), T, { dt: 0.01, nonNegative: false });
    const series = (x: number) => {
      let s = 0;
      for (let k = 1; k < 400; k += 2) s += ((8 * L * L) / (k ** 3 * Math.PI ** 3)) * Math.sin((k * Math.PI * x) / L) * Math.exp((-D * k * k * Math.PI ** 2 * T) / (L * L));
      return s;
    };
    const peak = series(L / 2);
    xs.forEach((x, i) => expect(Math.abs(u[i]! - series(x)) / peak).toBeLessThan(0.01));
  });

  it('conserves mass under pure diffusion on a masked grid with closed coasts', () => {
    // no-flux boundaries: d/dt Σu = 0 (divergence theorem); every face passes as much as it takes
    const rng = createRng(11);
    const mask: MaskCode[][] = Array.from({ length: 14 }, (_, y) => Array.from({ length: 18 }, (_, x) => ((x - 9) ** 2 + (y - 7) ** 2 < 40 && !(x > 12 && y < 5) ? (x < 6 ? 2 : 1) : 0)));
    const hab = habitatFromMask(mask, 0.5);
    const u0 = Array.from(hab.cells, () => 100 * rng.uniform());
    const before = totalStock(hab, u0);
    const u = integrateRd({ hab, growth: logistic, params: { r: 0, K: 1, D: 3 }, F: 0 }, u0, 4, { dt: 0.05, nonNegative: false });
    expect(Math.abs(totalStock(hab, u) / before - 1)).toBeLessThan(1e-12);
    expect(Math.max(...u) - Math.min(...u)).toBeLessThan(100);
  });
});

describe('reserves', () => {
  it('gives the critical length π√(D/r) for a reserve in lethal surroundings within 1%', () => {
    // Kierstead & Slobodkin 1953, J. Mar. Res. 12:141; Skellam 1951, Biometrika 38:196
    for (const p of [{ r: 0.5, K: 100, D: 2 }, { r: 1.3, K: 1, D: 0.05 }]) {
      const L = criticalLength(p, { coast: 60, centre: 30, F: null })!;
      expect(Math.abs(L / (Math.PI * Math.sqrt(p.D / p.r)) - 1)).toBeLessThan(0.01);
    }
  });

  it('gives the critical length 2√(D/r)·arctan(√((F − r)/r)) with fishing F > r outside, within 1%', () => {
    // linearised problem: cos inside, e^(−√((F−r)/D)|x|) outside, value and flux matched at the edge
    const p = { r: 0.5, K: 100, D: 2 };
    for (const F of [0.6, 1.5, 6]) {
      const L = criticalLength(p, { coast: 400, centre: 200, F })!;
      const formula = 2 * Math.sqrt(p.D / p.r) * Math.atan(Math.sqrt((F - p.r) / p.r));
      expect(Math.abs(L / formula - 1)).toBeLessThan(0.01);
    }
    expect(criticalLength(p, { coast: 400, centre: 200, F: 0.4 })).toBe(0);
  });

  it('gives a square reserve in lethal surroundings the critical side π√(2D/r)', () => {
    // separation of variables: λ₁ = r − 2π²D/L² (Skellam 1951)
    const p = { r: 1, K: 1, D: 0.5 };
    const side = Math.PI * Math.sqrt((2 * p.D) / p.r);
    const rate = (L: number) => {
      const n = 24;
      const hab = habitatFromMask(Array.from({ length: n }, () => Array(n).fill(2) as MaskCode[]), L / n, 'lethal');
      return principalRate({ hab, growth: logistic, params: p, F: 0 });
    };
    expect(rate(side * 1.01)).toBeGreaterThan(0);
    expect(rate(side * 0.99)).toBeLessThan(0);
  });

  it('lets the stock persist on a reserve longer than critical and lose it on a shorter one', () => {
    const p = { r: 0.5, K: 100, D: 2 };
    const crit = 2 * Math.sqrt(p.D / p.r) * Math.atan(Math.sqrt((3 - p.r) / p.r));
    const long = evaluateDesign(coastHabitat(100, 400, [[50 - 0.6 * crit, 50 + 0.6 * crit]]), logistic, p, 3);
    const short = evaluateDesign(coastHabitat(100, 400, [[50 - 0.4 * crit, 50 + 0.4 * crit]]), logistic, p, 3);
    expect(long.persists).toBeTrue();
    expect(long.sparseGrowthRate).toBeGreaterThan(0);
    expect(long.spillover).toBeGreaterThan(0);
    expect(long.yield).toBeGreaterThan(0);
    expect(short.persists).toBeFalse();
    expect(short.sparseGrowthRate).toBeLessThan(0);
  });

  it('finds extinction at F = r without a reserve and later with one, and yield and spillover balance', () => {
    // logistic under fishing mortality F: transcritical at F = r (Schaefer 1954)
    const p = { r: 0.6, K: 40, D: 1 };
    const none = fishingSweep(coastHabitat(30, 60, []), logistic, p, 1.2, 12);
    expect(none.criticalF!).toBeCloseTo(0.6, 6);
    // uniform equilibrium K(1 − F/r) everywhere: yield F·K(1 − F/r)·L
    const mid = none.points.find((q) => Math.abs(q.F - 0.3) < 1e-9)!;
    expect(mid.total).toBeCloseTo(40 * 0.5 * 30, 4);
    expect(mid.yield).toBeCloseTo(0.3 * 40 * 0.5 * 30, 4);
    // with a 3 km reserve the stock is lost where the critical length 2√(D/r)·arctan(√((F − r)/r)) reaches 3 km
    const hab = coastHabitat(30, 300, [[13.5, 16.5]]);
    const withReserve = fishingSweep(hab, logistic, p, 6, 12);
    const expected = p.r * (1 + Math.tan((3 / 2) * Math.sqrt(p.r / p.D)) ** 2);
    expect(Math.abs(withReserve.criticalF! / expected - 1)).toBeLessThan(0.01);
    expect(withReserve.kind).toBe('extinction');
    // at equilibrium the reserve's net growth leaves it as spillover (mass balance)
    const d = evaluateDesign(hab, logistic, p, 1);
    let reserveGrowth = 0;
    d.density.forEach((u, i) => { if (hab.reserve[i]) reserveGrowth += logistic.g(u, p) * hab.h; });
    expect(d.spillover).toBeCloseTo(reserveGrowth, 6);
  });

  it('finds a fold, not a transcritical point, when growth has an Allee effect', () => {
    // strong Allee effect: the fished branch ends at a saddle-node while the stock is still dense
    // (Lewis & Kareiva 1993)
    const p = { r: 0.8, K: 50, D: 1, A: 10 };
    const s = fishingSweep(coastHabitat(20, 40, []), GROWTH.allee, p, 1, 20);
    expect(s.kind).toBe('fold');
    // uniform stock: fold where F equals the largest per-capita growth r(u/A − 1)(1 − u/K) (max at u = (A+K)/2)
    const fold = p.r * ((30 / 10) - 1) * (1 - 30 / 50);
    expect(s.criticalF!).toBeCloseTo(fold, 3);
  });
});

describe('recovery front', () => {
  it('spreads from a reserve at 2√(rD) within 1%', () => {
    // Fisher 1937, Ann. Eugen. 7:355; Kolmogorov, Petrovsky & Piskunov 1937; the approach from below
    // (Bramson 1983) is why the speed is measured late, between 30% and 85% of a long coast
    const p = { r: 1, K: 1, D: 1 };
    const f = recoveryFront(coastHabitat(500, 2000, [[0, 10]]), logistic, p, { F: 0, years: 230, dt: 0.02, window: [0.3, 0.85] });
    expect(f.theory).toBe(2);
    expect(Math.abs(f.speed! / 2 - 1)).toBeLessThan(0.01);
  });
});
