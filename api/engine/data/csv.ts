/**
 * Brinkmark's plain CSV for a stock's annual data, read with csv-parse. Header row; one row a year.
 * Columns: `year`; `catch` (single stock) or `prey_catch` and `predator_catch` (linked stocks); one
 * column per survey index (any other name; for linked stocks `prey_index` and `predator_index`);
 * optional `<index>_cv`. Empty cells are missing values. Every problem is reported with its line.
 */
import { parse } from 'csv-parse/sync';
import type { StockSeries } from './series';
import { isStockRecruitHeader, parseStockRecruitRows } from './stock-recruit-csv';

export interface CsvProblem {
  line: number;
  column: string | null;
  value: string | null;
  problem: string;
  fix: string;
}

export type CsvResult = { ok: true; series: StockSeries; kind: 'single' | 'predator-prey' } | { ok: false; errors: CsvProblem[] };

/** A single stock's file holds either catch and survey indices or spawners and recruits (stock-recruit-csv.ts). */

export const MIN_YEARS = 10;
export const MAX_ROWS = 500;
/** Columns in one file: year, two catches, and room for many surveys with their CVs. */
export const MAX_COLUMNS = 60;
/** Characters in one line (a 60-column row of long decimals stays well below). */
export const MAX_LINE_CHARS = 4000;
const NAME = /^[a-z][a-z0-9_]{0,39}$/;
/** A plain decimal: optional minus, digits, optional fraction. No exponent, sign "+", hex, binary, spaces or separators. */
const PLAIN_DECIMAL = /^-?(?:\d+(?:\.\d*)?|\.\d+)$/;

/**
 * What a value may be, per kind of column (common practice: wider than any real stock, narrow enough
 * that the likelihood and the ODE solver stay in floating-point range).
 */
const RANGES = {
  catch: { max: 1e9, label: 'a catch', unit: 'at most 1,000,000,000' },
  index: { max: 1e12, label: 'a survey index', unit: 'at most 1,000,000,000,000' },
} as const;

export interface ParseOptions {
  /**
   * Accept any number JavaScript reads (exponents, "+", hex): only for versions stored before the
   * plain-decimal rule, so they still open. New uploads are always strict.
   */
  lenientNumbers?: boolean;
}

/** The first line longer than the limit, found in one pass (1-based), or 0. */
function longLine(text: string): number {
  let line = 1;
  let start = 0;
  for (let i = 0; i <= text.length; i++) {
    if (i === text.length || text.charCodeAt(i) === 10) {
      if (i - start > MAX_LINE_CHARS) return line;
      line++;
      start = i + 1;
    }
  }
  return 0;
}

/** The number of fields in the first line (a quick bound before the full parse). */
function firstLineColumns(text: string): number {
  const end = text.indexOf('\n');
  const first = end < 0 ? text : text.slice(0, end);
  let n = 1;
  for (let i = 0; i < first.length; i++) if (first.charCodeAt(i) === 44) n++;
  return n;
}

/** Parses and checks a CSV text in time linear in its size; never throws for bad input. */
export function parseStockCsv(text: string, options: ParseOptions = {}): CsvResult {
  const tooLong = longLine(text);
  if (tooLong) return fail([{ line: tooLong, column: null, value: null, problem: `Line ${tooLong} is longer than ${MAX_LINE_CHARS} characters.`, fix: 'Check that the file is a stock CSV with one row a year.' }]);
  if (firstLineColumns(text) > MAX_COLUMNS) return fail([{ line: 1, column: null, value: null, problem: `The header has more than ${MAX_COLUMNS} columns.`, fix: 'Keep year, catch, the survey indices and their CVs; drop other columns.' }]);
  let rows: string[][];
  try {
    rows = parse(text, { bom: true, skip_empty_lines: true, trim: true, relax_column_count: true }) as string[][];
  } catch (err) {
    const e = err as { lines?: number; code?: string; message: string };
    const unbalanced = text.split(/\r?\n/).findIndex((l) => (l.match(/"/g)?.length ?? 0) % 2 === 1);
    const quote = e.code === 'CSV_QUOTE_NOT_CLOSED';
    return fail([{
      line: quote && unbalanced >= 0 ? unbalanced + 1 : e.lines ?? 1, column: null, value: null,
      problem: quote ? 'A double quote opened here is never closed.' : `The file is not valid CSV (${e.code ?? 'parse error'}).`,
      fix: 'Check quotes and separators (comma-separated, double quotes around text with commas).',
    }]);
  }
  if (rows.length === 0) return fail([{ line: 1, column: null, value: null, problem: 'The file is empty.', fix: 'Upload a CSV with a header row and one row a year.' }]);
  if (rows.length - 1 > MAX_ROWS) return fail([{ line: MAX_ROWS + 2, column: null, value: null, problem: `More than ${MAX_ROWS} years.`, fix: 'Split the file or check that it is an annual series.' }]);
  const header = rows[0]!.map((h) => h.toLowerCase());
  if (header.length > MAX_COLUMNS) return fail([{ line: 1, column: null, value: null, problem: `The header has more than ${MAX_COLUMNS} columns.`, fix: 'Keep year, catch, the survey indices and their CVs; drop other columns.' }]);
  if (isStockRecruitHeader(header)) {
    const sr = parseStockRecruitRows(header, rows.slice(1));
    return sr.ok ? { ok: true, series: sr.series, kind: 'single' } : fail(sr.errors);
  }
  const headerErrors = checkHeader(header);
  if (headerErrors.length) return fail(headerErrors);
  const linked = header.includes('prey_catch');
  const catchCols = linked ? ['prey_catch', 'predator_catch'] : ['catch'];
  const indexCols = header.filter((h) => h !== 'year' && !catchCols.includes(h) && !h.endsWith('_cv'));
  const errors: CsvProblem[] = [];
  const positions = new Map(header.map((h, i) => [h, i]));
  const col = (name: string) => positions.get(name)!;
  const catchSet = new Set(catchCols);
  const indexSet = new Set(indexCols);
  const data = rows.slice(1);
  const years: number[] = [];
  const seenYears = new Set<number>();
  let previousValid = true;
  const cells = new Map<string, (number | null)[]>([...catchCols, ...indexCols, ...header.filter((h) => h.endsWith('_cv'))].map((c) => [c, []]));

  data.forEach((row, i) => {
    const line = i + 2;
    if (row.length !== header.length) {
      errors.push({ line, column: null, value: row.join(','), problem: `Row has ${row.length} cells, the header has ${header.length}.`, fix: 'Give every row one cell per header column (leave missing values empty).' });
      return;
    }
    const yText = row[col('year')]!;
    const year = Number(yText);
    const last = years[years.length - 1];
    const valid = yText !== '' && Number.isInteger(year) && year >= 1800 && year <= 2200;
    if (yText === '' || !Number.isInteger(year)) errors.push({ line, column: 'year', value: yText, problem: 'The year is not a whole number.', fix: 'Write the year as four digits, e.g. 1997.' });
    else if (!valid) errors.push({ line, column: 'year', value: yText, problem: 'The year is outside 1800–2200.', fix: 'Check the year column.' });
    else if (seenYears.has(year)) errors.push({ line, column: 'year', value: yText, problem: `Year ${year} appears twice.`, fix: 'Keep one row per year.' });
    else if (last !== undefined && year < last) errors.push({ line, column: 'year', value: yText, problem: `Year ${year} comes after ${last}: years are not increasing.`, fix: 'Sort the rows by year.' });
    else if (last !== undefined && previousValid && year !== last + 1) {
      const gap = year - 1 === last + 1 ? `Year ${last + 1} is missing.` : `Years ${last + 1}–${year - 1} are missing.`;
      errors.push({ line, column: 'year', value: yText, problem: gap, fix: 'Add a row for each year; leave unknown values empty.' });
    }
    if (valid) {
      years.push(year);
      seenYears.add(year);
    }
    previousValid = valid;
    for (const [name, values] of cells) {
      const text = row[col(name)]!;
      if (text === '' || text.toUpperCase() === 'NA') { values.push(null); continue; }
      const v = Number(text);
      if (!Number.isFinite(v) || (!options.lenientNumbers && !PLAIN_DECIMAL.test(text))) {
        errors.push({
          line, column: name, value: text.length > 40 ? `${text.slice(0, 40)}…` : text,
          problem: Number.isFinite(v) ? 'Not a plain decimal number (no exponent, "+" sign, hex or binary).' : Number.isNaN(v) ? 'Not a number.' : 'The number is too large to store.',
          fix: 'Use digits with a decimal point, e.g. 1990 or 514.6 (no units, no thousands separators); leave missing values empty.',
        });
        values.push(null);
        continue;
      }
      const range = catchSet.has(name) ? RANGES.catch : indexSet.has(name) ? RANGES.index : null;
      if (range && v > range.max) {
        errors.push({ line, column: name, value: text, problem: `Too large for ${range.label} (${range.unit}).`, fix: 'Check the units and the decimal point of this value.' });
        values.push(null);
        continue;
      }
      if (catchSet.has(name) && v < 0) errors.push({ line, column: name, value: text, problem: 'A catch cannot be negative.', fix: 'Enter the removals as a positive amount, or 0.' });
      if (indexSet.has(name) && v <= 0) errors.push({ line, column: name, value: text, problem: v === 0 ? 'An index of zero cannot be fitted (its logarithm is taken).' : 'A survey index cannot be negative.', fix: 'Leave the cell empty if the survey saw nothing or did not run.' });
      if (name.endsWith('_cv') && (v <= 0 || v > 5)) errors.push({ line, column: name, value: text, problem: 'A CV must be above 0 and at most 5.', fix: 'Enter the coefficient of variation as a fraction, e.g. 0.2.' });
      values.push(v);
    }
  });
  if (errors.length) return fail(errors);
  for (const c of catchCols) {
    if (cells.get(c)!.every((v) => v === null)) errors.push({ line: 2, column: c, value: null, problem: 'No catch is recorded in any year.', fix: 'Enter the removals for at least some years (use 0 for none).' });
  }
  for (const ix of indexCols) {
    const n = cells.get(ix)!.filter((v) => v !== null).length;
    if (n < MIN_YEARS) errors.push({ line: 1, column: ix, value: null, problem: `Only ${n} years have a value for ${ix}; at least ${MIN_YEARS} are needed to fit a model.`, fix: 'Add more survey years, or drop this column.' });
    const cv = cells.get(`${ix}_cv`);
    cv?.forEach((v, i) => {
      if (v !== null && cells.get(ix)![i] === null) errors.push({ line: i + 2, column: `${ix}_cv`, value: String(v), problem: 'A CV is given for a year without an index value.', fix: 'Remove the CV or enter the index value.' });
    });
  }
  if (errors.length) return fail(errors);
  const series: StockSeries = {
    years,
    catches: cells.get(catchCols[0]!)!,
    indices: indexCols.map((name) => ({ name, values: cells.get(name)!, cv: cells.get(`${name}_cv`) ?? null })),
  };
  if (linked) series.predatorCatches = cells.get('predator_catch')!;
  return { ok: true, series, kind: linked ? 'predator-prey' : 'single' };
}

function checkHeader(header: string[]): CsvProblem[] {
  const e = (problem: string, fix: string, column: string | null = null): CsvProblem => ({ line: 1, column, value: column, problem, fix });
  const out: CsvProblem[] = [];
  if (!header.includes('year')) out.push(e('There is no "year" column.', 'Name the first column "year".'));
  const seen = new Set<string>();
  const dup = header.find((h) => (seen.has(h) ? true : (seen.add(h), false)));
  if (dup !== undefined) out.push(e(`The column "${dup}" appears twice.`, 'Give every column its own name.', dup));
  for (const h of header) if (!NAME.test(h)) out.push(e(`"${h}" is not a usable column name.`, 'Use lower-case letters, digits and underscores, starting with a letter.', h));
  const linked = header.includes('prey_catch') || header.includes('predator_catch');
  if (linked) {
    for (const c of ['prey_catch', 'predator_catch', 'prey_index', 'predator_index']) if (!header.includes(c)) out.push(e(`A linked predator-prey file needs a "${c}" column.`, 'Add the column (values may be empty where unknown).'));
    if (header.includes('catch')) out.push(e('A linked file has "prey_catch" and "predator_catch", not "catch".', 'Remove or rename the "catch" column.', 'catch'));
  } else if (!header.includes('catch')) out.push(e('There is no "catch" column.', 'Add a "catch" column with the removals per year.'));
  const catchNames = ['year', 'catch', 'prey_catch', 'predator_catch'];
  const indices = header.filter((h) => !catchNames.includes(h) && !h.endsWith('_cv'));
  if (indices.length === 0) out.push(e('There is no survey index column.', 'Add at least one column of survey index values.'));
  const indexNames = new Set(indices);
  for (const h of header.filter((x) => x.endsWith('_cv'))) {
    if (!indexNames.has(h.slice(0, -3))) out.push(e(`"${h}" is a CV column for an index that is not in the file.`, `Name it after an index column, e.g. "${indices[0] ?? 'survey'}_cv".`, h));
  }
  return out;
}

function fail(errors: CsvProblem[]): CsvResult {
  return { ok: false, errors };
}

/** Writes a series back as Brinkmark CSV. */
export function formatStockCsv(series: StockSeries): string {
  const linked = series.predatorCatches !== undefined;
  const cols = ['year', ...(linked ? ['prey_catch', 'predator_catch'] : ['catch'])];
  for (const ix of series.indices) cols.push(ix.name, ...(ix.cv ? [`${ix.name}_cv`] : []));
  const cell = (v: number | null | undefined) => (v === null || v === undefined ? '' : String(v));
  const lines = series.years.map((y, i) => {
    const row = [String(y), cell(series.catches[i]), ...(linked ? [cell(series.predatorCatches![i])] : [])];
    for (const ix of series.indices) row.push(cell(ix.values[i]), ...(ix.cv ? [cell(ix.cv[i])] : []));
    return row.join(',');
  });
  return [cols.join(','), ...lines].join('\n') + '\n';
}
