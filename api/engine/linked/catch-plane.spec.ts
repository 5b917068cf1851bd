import { catchPlane, equilibriumAt, pairMargins } from './catch-plane';
import { predatorPreyPath, type RmParams } from './predator-prey';

// Rosenzweig-MacArthur with constant catches H_N, H_P. With g(N) = eaN/(1 + ahN) the predator
// equation gives P = H_P/(g − m), and the prey equation F(N) = rN(1 − N/K) − aN·H_P/D − H_N with
// D = N(ea − mah) − m (derivation by hand from Rosenzweig & MacArthur 1963; check-values.md). Hence
//   fold (F = F' = 0):  H_P = −r(1 − 2N/K)·D²/(am),  H_N = rN(1 − N/K) − aN·H_P/D
//   Hopf (tr J = 0):    H_P = (r(1 − 2N/K) + g − m)(g − m)(1 + ahN)²/a,
//                       H_N = rN(1 − N/K) − N(r(1 − 2N/K) + g − m)(1 + ahN)
// At H_P = 0 the Hopf point is where the prey isocline's hump sits at N* (Rosenzweig 1971).
describe('catch plane of Rosenzweig-MacArthur', () => {
  const p: RmParams = { r: 1, a: 0.02, h: 0.5, e: 0.5, m: 0.2, K: 100 };
  const spec = { model: 'rosenzweig-macarthur' as const, params: p };
  const { r, a, h, e, m, K } = p;
  const g = (N: number) => (e * a * N) / (1 + a * h * N);
  const D = (N: number) => N * (e * a - m * a * h) - m;
  const foldAt = (N: number) => { const HP = (-r * (1 - (2 * N) / K) * D(N) ** 2) / (a * m); return { HP, HN: r * N * (1 - N / K) - (a * N * HP) / D(N) }; };
  const hopfAt = (N: number) => {
    const c = r * (1 - (2 * N) / K) + g(N) - m;
    return { HP: (c * (g(N) - m) * (1 + a * h * N) ** 2) / a, HN: r * N * (1 - N / K) - N * c * (1 + a * h * N) };
  };
  const plane = catchPlane(spec, 40, 8, 16);
  const curve = (k: string) => plane.curves.find((c) => c.kind === k)!.points;

  it('the fold curve matches its closed form to 1e-6', () => {
    expect(curve('fold').length).toBeGreaterThan(5);
    for (const q of curve('fold')) {
      const c = foldAt(q.prey);
      expect(Math.abs(c.HP - q.predatorCatch)).withContext(`H_P ${q.predatorCatch}`).toBeLessThan(1e-6 * Math.max(1, q.predatorCatch));
      expect(Math.abs(c.HN - q.preyCatch)).withContext(`H_N at H_P ${q.predatorCatch}`).toBeLessThan(1e-6 * Math.max(1, q.preyCatch));
      expect(q.predator).toBeCloseTo((q.predatorCatch * (1 + a * h * q.prey)) / D(q.prey), 6);
    }
  });

  it('the Hopf curve matches its closed form to 1e-6 and starts at the hump of the prey isocline', () => {
    const pts = curve('hopf');
    expect(pts.length).toBeGreaterThan(3);
    for (const q of pts) {
      const c = hopfAt(q.prey);
      expect(Math.abs(c.HP - q.predatorCatch)).toBeLessThan(1e-6 * Math.max(1, q.predatorCatch));
      expect(Math.abs(c.HN - q.preyCatch)).toBeLessThan(1e-6 * Math.max(1, q.preyCatch));
    }
    // H_P = 0: N* = m/(a(e − mh)) = 25 and H = rN*[(1 − N*/K) − (1 − 2N*/K)(1 + ahN*)] = 3.125
    const first = pts.find((q) => q.predatorCatch === 0)!;
    expect(first.prey).toBeCloseTo(25, 6);
    expect(first.preyCatch).toBeCloseTo(3.125, 6);
  });

  it('the predator is lost (transcritical) at H_N = rN*(1 − N*/K) with no predator catch', () => {
    const t = curve('transcritical');
    expect(t.length).toBe(1);
    expect(t[0]!.preyCatch).toBeCloseTo(25 * 0.75, 6);
    expect(plane.stableAtZero).toBeTrue();
  });

  it('margins along each catch meet the curves where the closed forms put them', () => {
    const mg = pairMargins(spec, 2, 1, 40, 8);
    // Hopf at H_P = 1: solve hopfAt(N).HP = 1 for N on the stable side by bisection
    let lo = 25, hi = 40;
    for (let i = 0; i < 100; i++) { const mid = (lo + hi) / 2; if (hopfAt(mid).HP < 1) lo = mid; else hi = mid; }
    expect(mg.preyAxis.kind).toBe('hopf');
    expect(mg.preyAxis.at!).toBeCloseTo(hopfAt(lo).HN, 3);
    expect(mg.preyAxis.margin!).toBeCloseTo(hopfAt(lo).HN - 2, 3);
    expect(mg.crossing.kind === 'none' || mg.crossing.rayFraction! > 1).toBeTrue();
    const beyond = pairMargins(spec, 5, 1, 40, 8);
    expect(beyond.crossing.rayFraction!).toBeLessThan(1);
    expect(beyond.preyAxis.margin!).toBeLessThan(0);
  });

  it('the equilibrium at a pair of catches is a steady state of the annual path', () => {
    const eq = equilibriumAt(spec, 2, 1)!;
    const path = predatorPreyPath(spec, eq.x, [2, 2], [1, 1], 1e-10);
    expect(path.prey[2]!).toBeCloseTo(eq.x[0], 6);
    expect(path.predator[2]!).toBeCloseTo(eq.x[1], 6);
  });
});
