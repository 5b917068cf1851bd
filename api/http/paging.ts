/** Paging of list routes: ?limit=&offset= checked at the edge, and the page's figures in every answer. */
import { ValidationError } from './http-error';

export interface PageRequest {
  limit: number;
  offset: number;
}

export interface Page extends PageRequest {
  /** Rows in the whole list (all pages). */
  total: number;
}

/** Reads limit and offset from a query string; a missing one takes its default, a bad one is a 400 naming it. */
export function pageParams(query: Record<string, unknown>, { defaultLimit = 50, maxLimit = 200 } = {}): PageRequest {
  const read = (name: string, fallback: number, min: number, max: number): number => {
    const raw = query[name];
    if (raw === undefined || raw === '') return fallback;
    const n = typeof raw === 'string' && /^\d{1,9}$/.test(raw) ? Number(raw) : NaN;
    if (!Number.isSafeInteger(n) || n < min || n > max) {
      throw new ValidationError(`Query parameter ${name} must be a whole number from ${min} to ${max}.`, { [name]: [`${min}–${max}`] });
    }
    return n;
  };
  return { limit: read('limit', defaultLimit, 1, maxLimit), offset: read('offset', 0, 0, 1e9) };
}
