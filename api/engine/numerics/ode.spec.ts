import { integrate } from './ode';

// Hairer, Nørsett & Wanner, Solving ODEs I, §II.0 (Arenstorf orbit); values in ../shared/check-values.md.
describe('odex integration', () => {
  it('returns the Arenstorf orbit to its start after one period', () => {
    const mu = 0.012277471, mup = 1 - mu;
    const f = (_t: number, [y1, y2, v1, v2]: number[]) => {
      const d1 = ((y1! + mu) ** 2 + y2! ** 2) ** 1.5;
      const d2 = ((y1! - mup) ** 2 + y2! ** 2) ** 1.5;
      return [v1!, v2!, y1! + 2 * v2! - (mup * (y1! + mu)) / d1 - (mu * (y1! - mup)) / d2, y2! - 2 * v1! - (mup * y2!) / d1 - (mu * y2!) / d2];
    };
    const y0 = [0.994, 0, 0, -2.00158510637908252240537862224];
    const end = integrate(f, 0, y0, 17.0652165601579625588917206249, { tol: 1e-12, maxSteps: 100_000 }).y;
    expect(Math.abs(end[0]! - y0[0]!)).toBeLessThan(1e-6);
    expect(Math.abs(end[1]! - y0[1]!)).toBeLessThan(1e-6);
    expect(Math.abs(end[3]! - y0[3]!)).toBeLessThan(1e-5);
  });

  it('solves y\' = −y to e^(−1) at t = 1', () => {
    expect(integrate((_t, y) => [-y[0]!], 0, [1], 1, { tol: 1e-12 }).y[0]!).toBeCloseTo(Math.exp(-1), 11);
  });

  it('solves the logistic from N0 = 10 (r = 0.4, K = 1000) to N(10) = 355.460987', () => {
    expect(integrate((_t, y) => [0.4 * y[0]! * (1 - y[0]! / 1000)], 0, [10], 10, { tol: 1e-12 }).y[0]!).toBeCloseTo(355.460987, 6);
  });

  it('stops at a collapse instead of going negative', () => {
    const r = integrate((_t, y) => [-5], 0, [1], 2, { stopAtZero: true });
    expect(r.collapsed).toBeTrue();
    expect(r.y[0]).toBe(0);
    expect(r.t).toBeLessThan(2);
  });
});
