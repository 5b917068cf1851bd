/** Classical fixed-step Runge-Kutta for a scalar ODE, with collapse detection (fast stepping for fits). */

export interface ScalarStep {
  y: number;
  /** True when the solution reached zero within the interval (then y = 0). */
  collapsed: boolean;
}

/** Integrates y' = f(y) over [0, t] in n equal RK4 steps (Hairer, Nørsett & Wanner, Solving ODEs I, §II.1). */
export function rk4Scalar(f: (y: number) => number, y0: number, t: number, n: number): ScalarStep {
  const h = t / n;
  let y = y0;
  for (let i = 0; i < n; i++) {
    const k1 = f(y);
    const k2 = f(y + 0.5 * h * k1);
    const k3 = f(y + 0.5 * h * k2);
    const k4 = f(y + h * k3);
    y += (h / 6) * (k1 + 2 * k2 + 2 * k3 + k4);
    if (!(y > 0)) return { y: 0, collapsed: true };
  }
  return { y, collapsed: false };
}
