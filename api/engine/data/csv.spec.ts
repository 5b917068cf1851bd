import { readFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { formatStockCsv, parseStockCsv } from './csv';

const FIXTURES = resolve(import.meta.dirname, '..', '..', '..', 'test', 'fixtures', 'bad-csv');
const read = (f: string) => readFileSync(join(FIXTURES, f), 'utf8');

// One malformed file per row: the first problem reported must name this line, column and reason.
const BAD: [file: string, line: number, column: string | null, reason: RegExp][] = [
  ['01-empty.csv', 1, null, /file is empty/],
  ['02-no-year-column.csv', 1, null, /no "year" column/],
  ['03-no-catch-column.csv', 1, null, /no "catch" column/],
  ['04-no-index-column.csv', 1, null, /no survey index column/],
  ['05-duplicate-column.csv', 1, 'survey', /appears twice/],
  ['06-bad-column-name.csv', 1, 'survey index', /not a usable column name/],
  ['07-cv-without-index.csv', 1, 'trawl_cv', /CV column for an index that is not in the file/],
  ['08-short-row.csv', 14, null, /Row has 2 cells, the header has 3/],
  ['09-year-not-number.csv', 4, 'year', /not a whole number/],
  ['10-duplicate-year.csv', 5, 'year', /Year 1992 appears twice/],
  ['11-years-not-increasing.csv', 3, 'year', /missing/],
  ['12-missing-year.csv', 6, 'year', /Year 1994 is missing/],
  ['13-negative-catch.csv', 7, 'catch', /catch cannot be negative/],
  ['14-zero-index.csv', 8, 'survey', /index of zero cannot be fitted/],
  ['15-negative-index.csv', 8, 'survey', /survey index cannot be negative/],
  ['16-catch-with-units.csv', 9, 'catch', /Not a number/],
  ['17-too-few-years.csv', 1, 'survey', /Only 6 years .* at least 10/],
  ['18-no-catch-at-all.csv', 2, 'catch', /No catch is recorded/],
  ['19-cv-zero.csv', 4, 'survey_cv', /CV must be above 0/],
  ['20-cv-for-missing-index.csv', 5, 'survey_cv', /CV is given for a year without an index value/],
  ['21-linked-missing-predator-index.csv', 1, null, /needs a "predator_index" column/],
  ['22-unterminated-quote.csv', 2, null, /double quote opened here is never closed/],
  ['23-year-out-of-range.csv', 3, 'year', /outside 1800–2200/],
];

describe('stock CSV parser', () => {
  for (const [file, line, column, reason] of BAD) {
    it(`rejects ${file} at line ${line}${column ? `, column ${column}` : ''}`, () => {
      const r = parseStockCsv(read(file));
      expect(r.ok).toBeFalse();
      if (r.ok) return;
      const e = r.errors[0]!;
      expect(e.line).toBe(line);
      expect(e.column).toBe(column);
      expect(e.problem).toMatch(reason);
      expect(e.fix.length).toBeGreaterThan(10);
    });
  }

  it('reports every bad row, not just the first', () => {
    const r = parseStockCsv('year,catch,survey\n1990,-1,abc\n1991,2,0\n');
    expect(r.ok).toBeFalse();
    if (!r.ok) expect(r.errors.map((e) => `${e.line}:${e.column}`)).toEqual(['2:catch', '2:survey', '3:survey']);
  });

  it('reads a clean file with gaps and a CV column, and writes it back unchanged', () => {
    const rows = Array.from({ length: 12 }, (_, i) => `${2000 + i},${i === 4 ? '' : 10 + i},${i === 7 ? '' : 5 + i / 10},${i === 7 ? '' : 0.2}`);
    const text = ['year,catch,survey,survey_cv', ...rows].join('\n') + '\n';
    const r = parseStockCsv(text);
    expect(r.ok).toBeTrue();
    if (!r.ok) return;
    expect(r.kind).toBe('single');
    expect(r.series.catches[4]).toBeNull();
    expect(r.series.indices[0]!.values[7]).toBeNull();
    expect(r.series.indices[0]!.cv![0]).toBe(0.2);
    expect(formatStockCsv(r.series)).toBe(text);
  });

  it('reads every demo data file as a clean series', () => {
    for (const code of ['blue-lip-crab', 'silver-smelt', 'red-grouse', 'sprat-ridge-cod']) {
      const r = parseStockCsv(readFileSync(resolve(import.meta.dirname, '..', '..', '..', 'seeders', 'data', `${code}.csv`), 'utf8'));
      expect(r.ok).withContext(code).toBeTrue();
    }
  });
});
