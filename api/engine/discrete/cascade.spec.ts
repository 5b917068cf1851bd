import { cascade, FEIGENBAUM_DELTA } from './cascade';
import { DISCRETE_MODELS } from './stock-recruit';

const ricker = DISCRETE_MODELS.ricker;
const logistic = DISCRETE_MODELS['logistic-map'];
const bh = DISCRETE_MODELS['beverton-holt'];

describe('period-doubling cascade', () => {
  it('finds the Ricker map\'s first doubling at r = 2 and the second at 2.5264677', () => {
    // May 1976, Nature 261:459: the fixed point K has multiplier 1 − r, which reaches −1 at r = 2;
    // second doubling 2.526467725853819 from /work/shared/check-values.md (independent library)
    const c = cascade(ricker, { r: 2, K: 1000 }, { control: 'productivity', from: 1.3, to: 3, steps: 120 });
    expect(c.doublings[0]).toBeCloseTo(2, 10);
    expect(c.doublings[1]).toBeCloseTo(2.526467725853819, 9);
    expect(c.cyclesWhere).toBe('above');
  });

  it('finds the logistic map\'s doublings at 3, 1 + √6 and 3.5440904, and the period-3 window at 1 + √8', () => {
    // May 1976; third doubling and the window from /work/shared/check-values.md
    const c = cascade(logistic, { a: 3 }, { control: 'productivity', from: 2.6, to: 4, steps: 280 });
    expect(c.doublings[0]).toBeCloseTo(3, 10);
    expect(c.doublings[1]).toBeCloseTo(1 + Math.sqrt(6), 10);
    expect(c.doublings[2]).toBeCloseTo(3.544090359551923, 9);
    const three = c.windows.find((w) => w.period === 3)!;
    // the window opens at the tangent bifurcation 1 + √8; the grid step is 0.005
    expect(three.from).toBeGreaterThanOrEqual(1 + Math.sqrt(8));
    expect(three.from - (1 + Math.sqrt(8))).toBeLessThan(0.0051);
  });

  it('resolves Ricker doublings up to period 64 whose interval ratio is Feigenbaum\'s δ within 0.5%', () => {
    // Feigenbaum 1978, J. Stat. Phys. 19:25: δ = 4.669201609…
    const c = cascade(ricker, { r: 2, K: 1 }, { control: 'productivity', from: 1.5, to: 3, steps: 60, maxPeriod: 64 });
    expect(c.periods).toContain(64);
    const d = c.doublings;
    const n = c.periods.indexOf(64);
    const delta = (d[n - 1]! - d[n - 2]!) / (d[n]! - d[n - 1]!);
    expect(Math.abs(delta / 4.669201609 - 1)).toBeLessThan(0.005);
    // the onset of chaos lies beyond the last doubling and before 2.70 (Ricker accumulation ≈ 2.6924, from memory)
    expect(c.chaosOnset!).toBeGreaterThan(d[d.length - 1]!);
    expect(c.chaosOnset!).toBeLessThan(2.7);
    expect(FEIGENBAUM_DELTA).toBeCloseTo(4.669201609, 9);
  });

  it('puts the Ricker doublings under harvest at u = 1 − e^(2 − r), with cycles at lower harvest rates', () => {
    // escapement S = (1 − u)N follows S' = S·exp(r + ln(1 − u) − rS/K): a Ricker map with r_eff = r + ln(1 − u),
    // so the first doubling (r_eff = 2, May 1976) sits at u = 1 − e^(2 − r)
    const c = cascade(ricker, { r: 2.8, K: 500 }, { control: 'harvest', from: 0, to: 0.9, steps: 90 });
    expect(c.doublings[0]).toBeCloseTo(1 - Math.exp(2 - 2.8), 10);
    expect(c.doublings[1]).toBeCloseTo(1 - Math.exp(2.526467725853819 - 2.8), 8);
    expect(c.cyclesWhere).toBe('below');
    expect(c.collapseAt).toBeCloseTo(1 - Math.exp(-2.8), 12);
    expect(c.columns.find((col) => col.c > 0.6)!.regime).toBe('stable');
    expect(c.columns[0]!.regime).not.toBe('stable');
  });

  it('never finds a cycle in the Beverton-Holt map, whatever the productivity or harvest', () => {
    // Beverton & Holt 1957: the map is increasing, so orbits are monotone and settle (check-values.md)
    const byR = cascade(bh, { R: 2, K: 1000 }, { control: 'productivity', from: 1.01, to: 5000, steps: 100 });
    const byU = cascade(bh, { R: 400, K: 1000 }, { control: 'harvest', from: 0, to: 0.99, steps: 100 });
    for (const c of [byR, byU]) {
      expect(c.doublings).toEqual([]);
      expect(c.chaosOnset).toBeNull();
      expect(c.columns.every((col) => col.regime === 'stable' || col.regime === 'collapse')).toBeTrue();
    }
  });
});
