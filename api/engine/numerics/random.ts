/** Seeded pseudo-random numbers (mulberry32) and normal deviates, so every run can be reproduced. */

export interface Rng {
  uniform(): number;
  normal(): number;
  /** Integer in [0, n). */
  int(n: number): number;
}

/** A generator from a 32-bit seed. */
export function createRng(seed: number): Rng {
  let a = seed >>> 0;
  let spare: number | null = null;
  const uniform = () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  const normal = () => {
    if (spare !== null) {
      const s = spare;
      spare = null;
      return s;
    }
    // Box-Muller
    let u = 0;
    while (u === 0) u = uniform();
    const v = uniform();
    const rad = Math.sqrt(-2 * Math.log(u));
    spare = rad * Math.sin(2 * Math.PI * v);
    return rad * Math.cos(2 * Math.PI * v);
  };
  return { uniform, normal, int: (n) => Math.floor(uniform() * n) };
}
