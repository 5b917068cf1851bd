// The Taylor-series path for Pella-Tomlinson and Fox years against odex, the reference integrator.
// Sources: the models as in Pella & Tomlinson (1969) and Fox (1970); the exact logistic-harvest
// solution (Clark 1990, Mathematical Bioeconomics, §1.3) for the p = 1 case.
import { biomassPath, type SurplusModelName } from './surplus';
import { logisticHarvest } from './logistic-harvest';
import { taylorYear } from './surplus-taylor';

const K = 1000;
/** A catch series that rises, peaks and falls again over 40 years (invented). */
const catches = Array.from({ length: 40 }, (_, i) => 25 + 35 * Math.sin((Math.PI * i) / 40) ** 2);

function maxRelDiff(a: number[], b: number[]): number {
  return Math.max(...a.map((v, i) => Math.abs(v - b[i]!) / Math.max(Math.abs(b[i]!), 1e-12)));
}

describe('Taylor-series years (Pella-Tomlinson and Fox)', () => {
  const cases: { model: SurplusModelName; p: number }[] = [
    { model: 'pella-tomlinson', p: 0.3 }, { model: 'pella-tomlinson', p: 0.6 }, { model: 'pella-tomlinson', p: 1 },
    { model: 'pella-tomlinson', p: 2.5 }, { model: 'fox', p: 1 },
  ];
  for (const { model, p } of cases) {
    it(`follows odex to 1e-8 over 40 years for ${model}${model === 'fox' ? '' : ` p = ${p}`}, from low and high biomass, slow and fast growth`, () => {
      for (const r of [0.05, 0.3, 0.8, 1.6, 3]) {
        for (const d0 of [0.2, 0.9]) {
          const fast = biomassPath(model, { r, K, p }, d0 * K, catches);
          const ode = biomassPath(model, { r, K, p }, d0 * K, catches, { forceOdex: true, tol: 1e-12 });
          expect(fast.collapseYear).withContext(`r=${r} d0=${d0}`).toBe(ode.collapseYear);
          expect(maxRelDiff(fast.biomass, ode.biomass)).withContext(`r=${r} d0=${d0}`).toBeLessThan(1e-8);
        }
      }
    });
  }

  it('follows odex to 1e-8 when the removals are fishing mortalities F instead of catches', () => {
    const fs = catches.map((c) => c / 200);
    for (const model of ['pella-tomlinson', 'fox'] as const) {
      const fast = biomassPath(model, { r: 0.5, K, p: 0.6 }, 0.7 * K, fs, { control: 'F' });
      const ode = biomassPath(model, { r: 0.5, K, p: 0.6 }, 0.7 * K, fs, { control: 'F', forceOdex: true, tol: 1e-12 });
      expect(maxRelDiff(fast.biomass, ode.biomass)).withContext(model).toBeLessThan(1e-8);
    }
  });

  it('collapses in the same year as odex under a catch above the fold, and stays at zero', () => {
    const heavy = catches.map((c) => 4 * c);
    for (const model of ['pella-tomlinson', 'fox'] as const) {
      const fast = biomassPath(model, { r: 0.3, K, p: 0.6 }, 0.5 * K, heavy);
      const ode = biomassPath(model, { r: 0.3, K, p: 0.6 }, 0.5 * K, heavy, { forceOdex: true, tol: 1e-12 });
      expect(ode.collapseYear).withContext(model).not.toBeNull();
      expect(fast.collapseYear).withContext(model).toBe(ode.collapseYear);
      expect(fast.biomass.slice(fast.collapseYear! + 1).every((b) => b === 0)).withContext(model).toBeTrue();
      expect(maxRelDiff(fast.biomass.slice(0, ode.collapseYear!), ode.biomass.slice(0, ode.collapseYear!))).toBeLessThan(1e-8);
    }
  });

  it('with p = 1 reproduces the exact logistic-harvest solution (Clark 1990)', () => {
    for (const [r, C, N0] of [[0.4, 50, 300], [1.2, 200, 800], [0.1, 5, 950]] as const) {
      const step = taylorYear(false, r, r / K, 2, C, N0);
      const exact = logisticHarvest(r, K, C, N0, 1).N;
      expect(Math.abs(step.B - exact) / exact).toBeLessThan(1e-10);
    }
  });

  it('with no catch keeps a stock at carrying capacity (the equilibrium g(K) = 0 of both models)', () => {
    expect(Math.abs(taylorYear(false, 0.5 / 0.6, (0.5 / 0.6) * Math.pow(K, -0.6), 1.6, 0, K).B - K)).toBeLessThan(1e-9 * K);
    expect(Math.abs(taylorYear(true, 0.5 * Math.log(K), 0.5, 0, 0, K).B - K)).toBeLessThan(1e-9 * K);
  });
});
