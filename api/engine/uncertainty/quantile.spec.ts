import { quantile } from './bootstrap';

// Sample quantiles, definition 7 of Hyndman & Fan (1996), The American Statistician 50:361 (R's
// default): h = (n − 1)p + 1 on the sorted sample x₁ ≤ … ≤ xₙ, Q(p) = x⌊h⌋ + (h − ⌊h⌋)(x⌊h⌋+1 − x⌊h⌋).
describe('sample quantile (Hyndman & Fan type 7)', () => {
  it('interpolates between order statistics: [1, 2, 3, 4] at 0.1 is 1.3', () => {
    // h = 3·0.1 + 1 = 1.3 → 1 + 0.3·(2 − 1); R: quantile(1:4, 0.1) = 1.3
    expect(quantile([1, 2, 3, 4], 0.1)).toBeCloseTo(1.3, 12);
  });

  it('gives 2.5 for the median of [1, 2, 3, 4] and 3.25 for its upper quartile', () => {
    // h = 2.5 → 2 + 0.5·1; h = 3.25 → 3 + 0.25·1 (R: quantile(1:4, c(.5, .75)) = 2.50 3.25)
    expect(quantile([1, 2, 3, 4], 0.5)).toBeCloseTo(2.5, 12);
    expect(quantile([1, 2, 3, 4], 0.75)).toBeCloseTo(3.25, 12);
  });

  it('sorts its input and weights the gap between unequal neighbours', () => {
    // sorted [10, 20, 40, 80]; p = 0.9: h = 3.7 → 40 + 0.7·(80 − 40) = 68
    expect(quantile([80, 10, 40, 20], 0.9)).toBeCloseTo(68, 12);
    // p = 0.05 on 0..100 (101 values): h = 6 → exactly the 6th value, 5
    expect(quantile(Array.from({ length: 101 }, (_, i) => 100 - i), 0.05)).toBeCloseTo(5, 12);
  });

  it('returns the minimum at 0 and the maximum at 1, and leaves the caller\'s array as it was', () => {
    const xs = [3, -1, 7, 2];
    expect(quantile(xs, 0)).toBe(-1);
    expect(quantile(xs, 1)).toBe(7);
    expect(xs).toEqual([3, -1, 7, 2]);
  });

  it('is the one value of a single-value sample and NaN for an empty one', () => {
    expect(quantile([4.5], 0.3)).toBe(4.5);
    expect(quantile([], 0.5)).toBeNaN();
  });
});
