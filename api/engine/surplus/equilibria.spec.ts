import { allee } from './allee';
import { predation } from './predation';
import { schaefer } from './schaefer';
import { fox } from './fox';
import { analyseEquilibria, stateAtControl } from './equilibria';
import { biomassPath } from './surplus';
import { continueBranch } from '../numerics/continuation';

// Sources are named beside each check; the numbers are from ../shared/check-values.md.
describe('equilibria under a catch and under F', () => {
  // Spruce-budworm form du/dτ = Ru(1 − u/k) − u²/(1 + u²): the predation model with r = R, K = k,
  // c = 1, a = 1. Ludwig, Jones & Holling (1978) J. Anim. Ecol. 47:315; Strogatz (1994) §3.7: the
  // folds of the unharvested model lie on R = 2x³/(1+x²)², k = 2x³/(x² − 1), x > 1. Under fishing
  // mortality F the per-capita growth R(1 − u/k) − F is R'(1 − u/k') with R' = R − F, k' = k(R − F)/R,
  // so each fold at (F*, u*) must put (R − F*, k(R − F*)/R) on those curves at x = u*.
  it('puts every fold of the budworm form on the Strogatz bifurcation curves to 1e-6', () => {
    let checked = 0;
    for (const [R, k] of [[0.6, 12], [0.7, 20], [0.55, 8], [0.9, 30]] as const) {
      const a = analyseEquilibria(predation, { r: R, K: k, c: 1, a: 1 }, 'F');
      const folds = a.bifurcations.filter((b) => b.kind === 'fold');
      for (const f of folds) {
        const x = f.biomass;
        const Rp = R - f.at;
        expect(Math.abs(Rp - (2 * x ** 3) / (1 + x * x) ** 2)).withContext(`R ${R} k ${k}`).toBeLessThan(1e-6);
        expect(Math.abs((k * Rp) / R - (2 * x ** 3) / (x * x - 1))).withContext(`R ${R} k ${k}`).toBeLessThan(1e-6);
        checked++;
      }
    }
    expect(checked).toBeGreaterThanOrEqual(6);
  });

  // Strong Allee effect g(B) = rB(B/A − 1)(1 − B/K) (Lewis & Kareiva 1993; Courchamp, Berec &
  // Gascoigne 2008). g is a cubic: g'(B) = (r/(AK))(−3B² + 2(A+K)B − AK) = 0 at
  // B_m = [(A + K) + √((A + K)² − 3AK)]/3, and the fold harvest under a constant catch is g(B_m).
  it('puts the Allee fold harvest at the maximum of the cubic, in closed form, to 1e-9', () => {
    for (const [r, K, A] of [[0.5, 1000, 150], [1.2, 40_000, 3_000], [0.3, 1, 0.4]] as const) {
      const Bm = (A + K + Math.sqrt((A + K) ** 2 - 3 * A * K)) / 3;
      const hMax = r * Bm * (Bm / A - 1) * (1 - Bm / K);
      const a = analyseEquilibria(allee, { r, K, A }, 'catch');
      expect(Math.abs(a.collapse!.at - hMax) / hMax).toBeLessThan(1e-9);
      expect(Math.abs(a.collapse!.biomass - Bm) / Bm).toBeLessThan(1e-6);
      expect(a.bifurcations.length).toBe(1);
      // at zero catch the threshold is A
      expect(Math.abs(stateAtControl(allee, { r, K, A }, 'catch', 0).threshold! - A) / A).toBeLessThan(1e-9);
    }
  });

  it('says an Allee stock that has collapsed does not recover by cutting the harvest', () => {
    const a = analyseEquilibria(allee, { r: 0.5, K: 1000, A: 150 }, 'catch');
    expect(a.recovery).toBeNull();
    expect(a.recoveryNote).toContain('declines even unfished');
  });

  // Schaefer (1954): under fishing mortality F the equilibrium is K(1 − F/r), and extinction takes
  // over at F = r through a transcritical point, not a fold.
  it('gives the logistic under F a transcritical point at F = r and equilibrium K(1 − F/r)', () => {
    const p = { r: 0.4, K: 1000 };
    const a = analyseEquilibria(schaefer, p, 'F');
    expect(a.bifurcations.length).toBe(1);
    expect(a.bifurcations[0]!.kind).toBe('transcritical');
    expect(a.bifurcations[0]!.at).toBeCloseTo(0.4, 8);
    expect(a.collapse!.kind).toBe('transcritical');
    expect(a.hysteresis).toBeFalse();
    for (const F of [0.05, 0.2, 0.35]) expect(stateAtControl(schaefer, p, 'F', F).stable!).toBeCloseTo(1000 * (1 - F / 0.4), 6);
    // and under a constant catch the fold is at rK/4 (Clark 1990)
    expect(analyseEquilibria(schaefer, p, 'catch').collapse!.at).toBeCloseTo(100, 9);
  });

  it('says plainly that Fox has no fold and no transcritical point under F', () => {
    const a = analyseEquilibria(fox, { r: 0.4, K: 1000 }, 'F');
    expect(a.bifurcations).toEqual([]);
    expect(a.collapse).toBeNull();
    expect(a.recoveryNote).toContain('No fold');
  });

  // The hysteresis loop of Ludwig, Jones & Holling (1978) and May (1977): raising F slowly, the stock
  // follows the upper branch and drops at the upper fold; cutting F again, it stays low until the
  // lower fold, then climbs back. A simulated path must jump at those two controls.
  it('jumps at the two folds when F is raised and then cut along a simulated path', () => {
    const p = { r: 0.6, K: 12, c: 1, a: 1 };
    const a = analyseEquilibria(predation, p, 'F');
    expect(a.hysteresis).toBeTrue();
    const up = a.collapse!.at, down = a.recovery!.at;
    expect(down).toBeLessThan(up);
    const Fs = Array.from({ length: 121 }, (_, i) => (0.3 * i) / 120);
    const settle = (B: number, F: number) => biomassPath('predation', p, B, new Array(400).fill(F), { control: 'F' }).biomass[400]!;
    let B = a.unfished;
    const rising: number[] = [];
    for (const F of Fs) { B = settle(B, F); rising.push(B); }
    const falling: number[] = [];
    for (const F of [...Fs].reverse()) { B = settle(B, F); falling.push(B); }
    falling.reverse();
    const jump = (path: number[]) => path.findIndex((v, i) => i > 0 && Math.abs(v - path[i - 1]!) > 1.5);
    const iUp = jump(rising), iDown = jump(falling);
    // why one grid step of slack: next to a fold the return rate tends to 0 (critical slowing down)
    const step = Fs[1]!;
    expect(Fs[iUp]!).toBeGreaterThan(up);
    expect(Fs[iUp]!).toBeLessThanOrEqual(up + 2 * step);
    expect(Fs[iDown - 1]!).toBeLessThan(down);
    expect(Fs[iDown - 1]!).toBeGreaterThanOrEqual(down - 2 * step);
    expect(iDown).toBeLessThan(iUp);
  });

  it('agrees with pseudo-arclength continuation on the folds of the predation model (Keller 1977)', () => {
    const p = { r: 0.6, K: 12, c: 1, a: 1 };
    const a = analyseEquilibria(predation, p, 'F');
    const sys = { n: 1, F: ([B]: number[], F: number) => [predation.g(p, B!) - F * B!], scale: [p.K, p.r] };
    const branch = continueBranch(sys, [a.unfished], 0, { ds: 0.01, hMin: -1e-9, maxSteps: 5000 });
    const folds = branch.events.filter((e) => e.kind === 'fold').map((e) => e.h).sort();
    const mine = a.bifurcations.filter((b) => b.kind === 'fold').map((b) => b.at).sort();
    expect(folds.length).toBe(2);
    folds.forEach((h, i) => expect(Math.abs(h - mine[i]!)).toBeLessThan(1e-7));
  });
});
