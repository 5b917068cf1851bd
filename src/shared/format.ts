/** Display formats shared by pages (formatting only: the numbers come from the engine). */

/** A number to about four significant figures with thousands separators: 20535.16 → "20,540", 0.36334 → "0.3633". */
export function sig(v: number | null | undefined, digits = 4): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return '—';
  if (v === 0) return '0';
  const magnitude = Math.floor(Math.log10(Math.abs(v)));
  const decimals = Math.max(0, digits - 1 - magnitude);
  const rounded = Number(v.toPrecision(digits));
  return rounded.toLocaleString('en-US', { minimumFractionDigits: Math.min(decimals, 6), maximumFractionDigits: Math.min(decimals, 6) });
}

const MODEL_NAMES: Record<string, string> = {
  schaefer: 'Schaefer', 'pella-tomlinson': 'Pella-Tomlinson', fox: 'Fox',
  'rosenzweig-macarthur': 'Rosenzweig-MacArthur', 'lotka-volterra': 'Lotka-Volterra',
  ricker: 'Ricker', 'beverton-holt': 'Beverton-Holt', 'reaction-diffusion': 'Reaction-diffusion (reserve study)',
};

/** The published name of a model code. */
export function modelName(code: string): string {
  return MODEL_NAMES[code] ?? code;
}

/**
 * The engine's proposed level as the value a person starts from: a catch in whole units, an F to
 * three decimals, always rounded down, because rounding up can carry a level past its risk bound.
 */
export function proposalStart(proposed: number | null | undefined, control: 'catch' | 'F' = 'catch'): number {
  if (proposed === null || proposed === undefined || !Number.isFinite(proposed) || proposed <= 0) return 0;
  const step = control === 'F' ? 1000 : 1;
  return Math.floor(proposed * step + 1e-9) / step;
}
