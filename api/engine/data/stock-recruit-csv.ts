/**
 * The stock-recruitment variant of the stock CSV: `year`, `spawners`, `recruits` and optionally
 * `catch`. `recruits` in a row are the recruits produced by that year's spawners. Empty cells are
 * missing values; every problem is reported with its line, column, value and a fix.
 */
import type { CsvProblem } from './csv';
import type { StockSeries } from './series';

export const SR_COLUMNS = ['year', 'spawners', 'recruits', 'catch'] as const;
export const MIN_PAIRS = 10;

/** True when the header names a stock-recruitment file. */
export function isStockRecruitHeader(header: string[]): boolean {
  return header.includes('spawners') || header.includes('recruits');
}

/** Parses the rows of a stock-recruitment file (header already lower-cased); never throws. */
export function parseStockRecruitRows(header: string[], data: string[][]): { ok: true; series: StockSeries } | { ok: false; errors: CsvProblem[] } {
  const headerErrors = checkStockRecruitHeader(header);
  if (headerErrors.length) return { ok: false, errors: headerErrors };
  const col = (name: string) => header.indexOf(name);
  const errors: CsvProblem[] = [];
  const years: number[] = [];
  const spawners: (number | null)[] = [], recruits: (number | null)[] = [], catches: (number | null)[] = [];
  data.forEach((row, i) => {
    const line = i + 2;
    if (row.length !== header.length) {
      errors.push({ line, column: null, value: row.join(','), problem: `Row has ${row.length} cells, the header has ${header.length}.`, fix: 'Give every row one cell per header column (leave missing values empty).' });
      return;
    }
    const yearProblem = checkYear(row[col('year')]!, years);
    if (yearProblem) errors.push({ line, column: 'year', value: row[col('year')]!, ...yearProblem });
    else years.push(Number(row[col('year')]));
    spawners.push(cell(row, col('spawners'), 'spawners', line, errors, 'positive'));
    recruits.push(cell(row, col('recruits'), 'recruits', line, errors, 'positive'));
    catches.push(col('catch') >= 0 ? cell(row, col('catch'), 'catch', line, errors, 'non-negative') : null);
  });
  if (errors.length) return { ok: false, errors };
  const pairs = spawners.filter((s, i) => s !== null && recruits[i] !== null).length;
  if (pairs < MIN_PAIRS) {
    return { ok: false, errors: [{ line: 1, column: 'recruits', value: null, problem: `Only ${pairs} years have both spawners and recruits; at least ${MIN_PAIRS} are needed to fit a stock-recruitment model.`, fix: 'Add more years with both values.' }] };
  }
  return { ok: true, series: { years, catches, indices: [], stockRecruit: { spawners, recruits } } };
}

function checkStockRecruitHeader(header: string[]): CsvProblem[] {
  const e = (problem: string, fix: string, column: string | null = null): CsvProblem => ({ line: 1, column, value: column, problem, fix });
  const out: CsvProblem[] = [];
  for (const c of ['year', 'spawners', 'recruits']) if (!header.includes(c)) out.push(e(`A stock-recruitment file needs a "${c}" column.`, 'Columns: year, spawners, recruits and optionally catch.'));
  for (const h of header) if (!(SR_COLUMNS as readonly string[]).includes(h)) out.push(e(`"${h}" is not a column of a stock-recruitment file.`, 'Use only year, spawners, recruits and catch; survey indices go in a separate file.', h));
  const dup = header.find((h, i) => header.indexOf(h) !== i);
  if (dup !== undefined) out.push(e(`The column "${dup}" appears twice.`, 'Give every column its own name.', dup));
  return out;
}

function checkYear(text: string, years: number[]): { problem: string; fix: string } | null {
  const year = Number(text);
  const last = years[years.length - 1];
  if (text === '' || !Number.isInteger(year)) return { problem: 'The year is not a whole number.', fix: 'Write the year as four digits, e.g. 1997.' };
  if (year < 1800 || year > 2200) return { problem: 'The year is outside 1800–2200.', fix: 'Check the year column.' };
  if (years.includes(year)) return { problem: `Year ${year} appears twice.`, fix: 'Keep one row per year.' };
  if (last !== undefined && year < last) return { problem: `Year ${year} comes after ${last}: years are not increasing.`, fix: 'Sort the rows by year.' };
  if (last !== undefined && year !== last + 1) return { problem: year - 1 === last + 1 ? `Year ${last + 1} is missing.` : `Years ${last + 1}–${year - 1} are missing.`, fix: 'Add a row for each year; leave unknown values empty.' };
  return null;
}

function cell(row: string[], at: number, name: string, line: number, errors: CsvProblem[], sign: 'positive' | 'non-negative'): number | null {
  const text = row[at]!;
  if (text === '' || text.toUpperCase() === 'NA') return null;
  const v = Number(text);
  if (!/^-?(?:\d+(?:\.\d*)?|\.\d+)$/.test(text) || !Number.isFinite(v)) {
    errors.push({ line, column: name, value: text, problem: 'Not a number.', fix: 'Use digits with a decimal point (no units, no thousands separators); leave missing values empty.' });
    return null;
  }
  if (sign === 'positive' && v <= 0) errors.push({ line, column: name, value: text, problem: `${name === 'spawners' ? 'Spawners' : 'Recruits'} must be above zero (their logarithm is taken).`, fix: 'Leave the cell empty if the value is unknown.' });
  if (sign === 'non-negative' && v < 0) errors.push({ line, column: name, value: text, problem: 'A catch cannot be negative.', fix: 'Enter the removals as a positive amount, or 0.' });
  return v;
}
