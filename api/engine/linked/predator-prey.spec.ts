import { integrate } from '../numerics/ode';
import { equilibriumStability, harvestBifurcations, interiorEquilibrium, predatorPreyPath, predatorPreyRhs, rmHopfK, type PredatorPreySpec } from './predator-prey';

// ../shared/check-values.md: Volterra (1926) Nature 118:558; Rosenzweig & MacArthur (1963) Am. Nat.
// 97:209; Rosenzweig (1971) Science 171:385.
describe('predator-prey models', () => {
  const lv: PredatorPreySpec = { model: 'lotka-volterra', params: { a: 1, b: 0.1, c: 1.5, d: 0.075, K: Infinity } };

  it('Lotka-Volterra keeps H = dx − c·ln x + by − a·ln y constant along an odex path', () => {
    const { a, b, c, d } = lv.params as { a: number; b: number; c: number; d: number };
    const H = ([x, y]: number[]) => d * x! - c * Math.log(x!) + b * y! - a * Math.log(y!);
    const f = predatorPreyRhs(lv);
    let y = [10, 5];
    const h0 = H(y);
    for (let t = 0; t < 30; t++) {
      y = integrate(f, t, y, t + 1, { tol: 1e-11 }).y;
      expect(Math.abs(H(y) - h0) / Math.abs(h0)).toBeLessThan(1e-8);
    }
  });

  it('Lotka-Volterra equilibrium is (c/d, a/b), and harvest at rate F moves it to ((c+F)/d, (a−F)/b)', () => {
    expect(interiorEquilibrium(lv)).toEqual([20, 10]);
    const [x, y] = interiorEquilibrium(lv, { preyRate: 0.2, predatorRate: 0.2 });
    expect(x).toBeCloseTo((1.5 + 0.2) / 0.075, 12);
    expect(y).toBeCloseTo((1 - 0.2) / 0.1, 12);
  });

  it('Lotka-Volterra small oscillations have period 2π/√(ac)', () => {
    const f = predatorPreyRhs(lv);
    const { eigen } = equilibriumStability(lv, {}, 20, 10);
    expect(Math.abs(eigen.re[0]!)).toBeLessThan(1e-6);
    expect((2 * Math.PI) / eigen.im[0]!).toBeCloseTo((2 * Math.PI) / Math.sqrt(1.5), 5);
    expect(f(0, [20, 10]).every((v) => Math.abs(v) < 1e-12)).toBeTrue();
  });

  const rm = (K: number): PredatorPreySpec => ({ model: 'rosenzweig-macarthur', params: { r: 1, a: 0.02, h: 0.5, e: 0.5, m: 0.2, K } });

  it('Rosenzweig-MacArthur: N* = 25, K_crit = 2N* + 1/(ah) = 150, P* = 46.875 and λ = −0.05 ± 0.342783i at K = 100', () => {
    const spec = rm(100);
    const [N, P] = interiorEquilibrium(spec);
    expect(N).toBeCloseTo(25, 12);
    expect(P).toBeCloseTo(46.875, 10);
    expect(rmHopfK(spec.params as never)).toBeCloseTo(150, 10);
    const { eigen, stable } = equilibriumStability(spec, {}, N, P);
    expect(stable).toBeTrue();
    expect(eigen.re[0]!).toBeCloseTo(-0.05, 6);
    expect(Math.abs(eigen.im[0]!)).toBeCloseTo(0.342783, 5);
  });

  it('Rosenzweig-MacArthur is stable just below K_crit and unstable just above (the Hopf condition)', () => {
    for (const [K, stable] of [[148, true], [152, false]] as const) {
      const spec = rm(K);
      const [N, P] = interiorEquilibrium(spec);
      expect(equilibriumStability(spec, {}, N, P).stable).withContext(`K=${K}`).toBe(stable);
    }
  });

  it('continuation in predator catch finds a fold; in prey catch a Hopf point where the trace vanishes', () => {
    const spec = rm(100);
    const start = interiorEquilibrium(spec);
    const pred = harvestBifurcations(spec, {}, 'predatorCatch', start, 50);
    const fold = pred.events.find((e) => e.kind === 'fold')!;
    expect(fold).toBeDefined();
    // at the fold the Jacobian is singular
    const J = equilibriumStability(spec, { predatorCatch: fold.h }, fold.x[0]!, fold.x[1]!).eigen;
    expect(Math.min(...J.re.map(Math.abs))).toBeLessThan(1e-3);
    const prey = harvestBifurcations(spec, {}, 'preyCatch', start, 50);
    const hopf = prey.events.find((e) => e.kind === 'hopf')!;
    expect(hopf).toBeDefined();
    const eig = equilibriumStability(spec, { preyCatch: hopf.h }, hopf.x[0]!, hopf.x[1]!).eigen;
    expect(Math.abs(eig.re[0]!)).toBeLessThan(1e-3);
    expect(Math.abs(eig.im[0]!)).toBeGreaterThan(0.1);
  });
});

// A species at zero stays at zero; the other follows its own dynamics.
describe('predator-prey path when one species dies out', () => {
  const spec: PredatorPreySpec = { model: 'rosenzweig-macarthur', params: { r: 0.8, a: 0.02, h: 0.5, e: 0.5, m: 0.3, K: 1000 } };

  it('prey without predators grows logistically: N(t) = K/(1 + (K/N0 − 1)e^{−rt}) (Verhulst 1838)', () => {
    const path = predatorPreyPath(spec, [50, 0], new Array(10).fill(0), new Array(10).fill(0), 1e-10);
    for (let t = 0; t <= 10; t++) {
      expect(path.prey[t]!).toBeCloseTo(1000 / (1 + (1000 / 50 - 1) * Math.exp(-0.8 * t)), 6);
      expect(path.predator[t]).toBe(0);
    }
    expect(path.predatorExtinctYear).toBe(0);
    expect(path.preyExtinctYear).toBeNull();
  });

  it('predators without prey decline as e^{−mt}', () => {
    const path = predatorPreyPath(spec, [0, 40], new Array(5).fill(0), new Array(5).fill(0), 1e-10);
    for (let t = 0; t <= 5; t++) expect(path.predator[t]!).toBeCloseTo(40 * Math.exp(-0.3 * t), 8);
  });

  it('a predator fished out in year 2 leaves the prey growing, never set to zero', () => {
    const path = predatorPreyPath(spec, [300, 5], [0, 0, 0, 0, 0, 0], [0, 0, 500, 500, 500, 500], 1e-10);
    expect(path.predatorExtinctYear).toBe(2);
    expect(path.collapseYear).toBe(2);
    expect(path.predator.slice(3)).toEqual([0, 0, 0, 0]);
    for (let t = 3; t <= 6; t++) expect(path.prey[t]!).toBeGreaterThan(path.prey[t - 1]!);
    // after the predator is gone (years 3 → 6) the prey follows the logistic solution exactly
    const n3 = path.prey[3]!;
    expect(path.prey[6]!).toBeCloseTo(1000 / (1 + (1000 / n3 - 1) * Math.exp(-0.8 * 3)), 6);
  });
});
