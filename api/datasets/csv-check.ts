/** The full check of an uploaded CSV (parse, rules, preview cells): pure, run in the checker's worker thread. */
import { parse } from 'csv-parse/sync';
import { MAX_COLUMNS, parseStockCsv } from '../engine/data/csv';
import type { CsvCheck } from './dataset.schemas';

/** Raw cells for the preview table (best effort: empty when the text is not CSV at all; at most MAX_COLUMNS wide). */
function rawTable(csv: string): { header: string[]; rows: string[][] } {
  try {
    const all = parse(csv, { bom: true, skip_empty_lines: true, trim: true, relax_column_count: true, relax_quotes: true }) as string[][];
    const cut = (r: string[]) => r.slice(0, MAX_COLUMNS);
    return { header: cut(all[0] ?? []), rows: all.slice(1).map(cut) };
  } catch {
    return { header: [], rows: [] };
  }
}

/** Checks a CSV; `lenientNumbers` only for versions stored before the plain-decimal rule. */
export function checkCsv(csv: string, lenientNumbers = false): CsvCheck {
  const r = parseStockCsv(csv, { lenientNumbers });
  const table = rawTable(csv);
  return r.ok ? { ok: true, kind: r.kind, series: r.series, ...table } : { ok: false, errors: r.errors, ...table };
}
