import { assessSurplus } from '../assessment';
import { FitInputError, fitSurplusRaw } from './fit-surplus';
import { biomassPath } from './surplus';
import { createRng } from '../numerics/random';

// A stock whose catches cannot scale its biomass, and a first-year biomass above K: the fit must
// refuse or warn, never report a silent answer. Dynamics: Schaefer (1954), simulated here with a
// fixed seed; the numbers asserted are properties of the inputs, not outputs of the fit.
describe('honest edges of a single-stock fit', () => {
  const years = Array.from({ length: 30 }, (_, i) => 1990 + i);
  const simulate = (catches: number[], d0: number) => {
    const rng = createRng(42);
    const path = biomassPath('schaefer', { r: 0.4, K: 10_000 }, d0 * 10_000, catches).biomass;
    return { years, catches, indices: [{ name: 'survey', values: years.map((_, t) => 0.001 * path[t]! * Math.exp(0.1 * rng.normal())), cv: null }] };
  };

  it('refuses a series whose catches are all zero, saying the biomass scale needs removals', () => {
    const series = simulate(years.map(() => 0), 0.3);
    expect(() => fitSurplusRaw(series, { model: 'fox' })).toThrowMatching((e) => e instanceof FitInputError && /cannot be estimated without removals/.test(e.message));
    expect(() => fitSurplusRaw(series, { model: 'schaefer' })).toThrowError(FitInputError);
  });

  it('fits the same zero-catch series once K is fixed', () => {
    const fit = fitSurplusRaw(simulate(years.map(() => 0), 0.3), { model: 'schaefer', fixed: { K: 10_000 } });
    expect(fit.problem.decode(fit.u).K).toBe(10_000);
  });

  it('keeps B0/K at most 1 unless the assessor allows more, and then warns', () => {
    const catches = years.map((_, i) => (i < 15 ? 400 + 60 * i : 600));
    const series = simulate(catches, 1.3);
    const plain = assessSurplus(series, { model: 'schaefer' }).fit;
    expect(plain.params.d0).toBeLessThanOrEqual(1);
    const allowed = assessSurplus(series, { model: 'schaefer', allowAboveK: true }).fit;
    expect(allowed.params.d0).toBeGreaterThan(1);
    expect(allowed.convergence.warnings.some((w) => w.includes('above K'))).toBeTrue();
  });

  it('gives B0/K on its bound a one-sided interval, never a zero-width one', () => {
    const catches = years.map((_, i) => (i < 15 ? 400 + 60 * i : 600));
    const fit = assessSurplus(simulate(catches, 1.3), { model: 'schaefer' }).fit;
    const d0 = fit.estimates.find((e) => e.name === 'B0/K')!;
    expect(d0.ci95).not.toBeNull();
    expect(d0.ci95![1] - d0.ci95![0]).toBeGreaterThan(0);
    expect(d0.open?.upper).toBeTrue();
  });
});
