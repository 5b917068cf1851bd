/** Parsing of the command line's list and range arguments, with usage errors that name the option. */

export class UsageError extends Error {}

/** "r=2.1,K=1000" → { r: 2.1, K: 1000 }. */
export function parseParamList(text: string | undefined, option: string): Record<string, number> {
  if (!text) throw new UsageError(`--${option} is required, e.g. --${option} r=2.1,K=1000`);
  const out: Record<string, number> = {};
  for (const part of text.split(',')) {
    const [k, v, extra] = part.split('=');
    const n = Number(v);
    if (!k || v === undefined || extra !== undefined || v.trim() === '' || !Number.isFinite(n)) throw new UsageError(`--${option}: "${part}" is not NAME=NUMBER`);
    out[k.trim()] = n;
  }
  return out;
}

/** "FROM:TO" or "FROM:TO:STEP" → numbers; checks order and step. */
export function parseRange(text: string, option: string, withStep: boolean): { from: number; to: number; step: number | null } {
  const parts = text.split(':').map((s) => (s.trim() === '' ? NaN : Number(s)));
  const ok = (withStep ? parts.length === 2 || parts.length === 3 : parts.length === 2) && parts.every(Number.isFinite);
  if (!ok) throw new UsageError(`--${option} must be FROM:TO${withStep ? '[:STEP]' : ''} with numbers, not "${text}"`);
  const [from, to, step] = parts as [number, number, number | undefined];
  if (!(to > from)) throw new UsageError(`--${option}: TO must be larger than FROM`);
  if (step !== undefined && !(step > 0 && step <= to - from)) throw new UsageError(`--${option}: STEP must be positive and at most TO − FROM`);
  return { from, to, step: step ?? null };
}

/** A finite number option, or its default. */
export function numberOption(v: string | undefined, name: string, def: number): number {
  if (v === undefined) return def;
  const n = Number(v);
  if (v.trim() === '' || !Number.isFinite(n)) throw new UsageError(`--${name} must be a number, not "${v}"`);
  return n;
}
