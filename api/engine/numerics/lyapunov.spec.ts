import { lyapunovSpectrum, orthonormalise } from './lyapunov';
import { equilibriumStability, interiorEquilibrium, jacobianAt, predatorPreyRhs, type PredatorPreySpec } from '../linked/predator-prey';
import { foodChainJacobian, foodChainRhs, HASTINGS_POWELL } from '../linked/food-chain';
import { predictabilityHorizon } from '../linked/chain-dynamics';

// Benettin, Galgani, Giorgilli & Strelcyn (1980) Meccanica 15:9 (the method); check values as named below.
describe('Lyapunov spectrum (Benettin et al. 1980, QR re-orthonormalisation)', () => {
  it('Gram-Schmidt returns orthonormal columns and |det| as the product of the diagonal', () => {
    const cols = [[2, 0, 0], [1, 3, 0], [4, 5, 6]];
    const d = orthonormalise(cols);
    // det of the matrix with these columns is 2·3·6 = 36 (triangular)
    expect(d.reduce((a, b) => a * b, 1)).toBeCloseTo(36, 10);
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) {
      const dot = cols[i]!.reduce((s, v, k) => s + v * cols[j]![k]!, 0);
      expect(dot).toBeCloseTo(i === j ? 1 : 0, 12);
    }
  });

  it('Lorenz (σ 10, ρ 28, β 8/3): the exponents sum to the Jacobian trace −(σ + 1 + β) and λ₁ ≈ 0.906', () => {
    const s = 10, r = 28, b = 8 / 3;
    const f = (_t: number, [x, y, z]: number[]) => [s * (y! - x!), x! * (r - z!) - y!, x! * y! - b * z!];
    const J = ([x, y, z]: number[]) => [[-s, s, 0], [r - z!, -1, -x!], [y!, x!, -b]];
    const { exponents } = lyapunovSpectrum(f, J, [1, 1, 1], { transient: 50, time: 1000, interval: 0.5 });
    // trace of the Jacobian is constant: −13.6667 (exact)
    expect(exponents.reduce((a, v) => a + v, 0)).toBeCloseTo(-(s + 1 + b), 3);
    // λ₁ ≈ 0.906: Sprott (2003) Chaos and Time-Series Analysis, from memory; to 2%
    expect(Math.abs(exponents[0]! / 0.906 - 1)).toBeLessThan(0.02);
    // a flow has a zero exponent along the trajectory (Haken 1983)
    expect(Math.abs(exponents[1]!)).toBeLessThan(0.01);
  });

  const rm = (K: number): PredatorPreySpec => ({ model: 'rosenzweig-macarthur', params: { r: 1, a: 0.02, h: 0.5, e: 0.5, m: 0.2, K } });
  const rmJac = (spec: PredatorPreySpec) => (y: number[]) => jacobianAt(spec, {}, y[0]!, y[1]!);

  it('Rosenzweig-MacArthur above its Hopf point (K = 200 > K_crit = 150) cycles: the largest exponent is 0 to 1e-2', () => {
    // check-values.md: K_crit = 2N* + 1/(ah) = 150 (Rosenzweig 1971); above it a stable limit cycle
    const spec = rm(200);
    const { exponents } = lyapunovSpectrum(predatorPreyRhs(spec), rmJac(spec), [40, 20], { transient: 500, time: 2000, interval: 1 });
    expect(Math.abs(exponents[0]!)).toBeLessThan(1e-2);
    expect(exponents[1]!).toBeLessThan(-1e-2);
  });

  it('Rosenzweig-MacArthur at its stable equilibrium (K = 100): both exponents equal Re λ = −0.05 to 1e-3', () => {
    // check-values.md: eigenvalues −0.05 ± 0.342783i at K = 100 (Rosenzweig & MacArthur 1963)
    const spec = rm(100);
    const eq = interiorEquilibrium(spec);
    const re = equilibriumStability(spec, {}, eq[0], eq[1]).eigen.re[0]!;
    expect(re).toBeCloseTo(-0.05, 6);
    const { exponents } = lyapunovSpectrum(predatorPreyRhs(spec), rmJac(spec), eq, { transient: 0, time: 5000, interval: 1 });
    expect(Math.abs(exponents[0]! - re)).toBeLessThan(1e-3);
    expect(Math.abs(exponents[1]! - re)).toBeLessThan(1e-3);
  });

  it('the Hastings-Powell chain at its published parameters is chaotic: λ₁ > 0, λ₂ ≈ 0, λ₃ < 0', () => {
    // Hastings & Powell (1991) Ecology 72:896: a1 = 5, b1 = 3, a2 = 0.1, b2 = 2, d1 = 0.4, d2 = 0.01
    const p = { r: 1, K: 1, yScale: 1, zScale: 1, ...HASTINGS_POWELL };
    const { exponents } = lyapunovSpectrum(foodChainRhs(p), foodChainJacobian(p), [0.76, 0.16, 9.9], { transient: 2000, time: 20000, interval: 5, tol: 1e-8 });
    expect(exponents[0]!).toBeGreaterThan(2e-3);
    expect(Math.abs(exponents[1]!)).toBeLessThan(2e-3);
    expect(exponents[2]!).toBeLessThan(-0.1);
  });

  it('the predictability horizon is ln(tolerance / error) / λ₁, and unbounded when errors do not grow', () => {
    // definition: an initial error δ₀ grows as δ₀·e^{λ₁t} (Lorenz 1969; Wolf et al. 1985)
    expect(predictabilityHorizon(0.02, 0.05, 0.4)).toBeCloseTo(Math.log(8) / 0.02, 12);
    expect(predictabilityHorizon(-0.01, 0.05, 0.4)).toBe(Infinity);
    expect(predictabilityHorizon(0.02, 0.5, 0.4)).toBe(0);
    expect(() => predictabilityHorizon(0.02, 0, 0.4)).toThrowError(/positive/);
  });
});
