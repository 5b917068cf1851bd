/**
 * A region's habitat mask as a small CSV grid: no header, one line per row of cells (north at the
 * top), one code per cell: 0 not habitat (land or water the stock does not use), 1 fished habitat,
 * 2 reserve. Every problem is reported with its line, cell and a fix.
 */
import type { CsvProblem } from '../data/csv';
import type { MaskCode } from './habitat';

export const MAX_MASK_SIDE = 60;

/** Parses a mask; never throws. */
export function parseMaskCsv(text: string): { ok: true; mask: MaskCode[][] } | { ok: false; errors: CsvProblem[] } {
  const lines = text.replace(/^\uFEFF/, '').split(/\r?\n/).map((l) => l.trim());
  while (lines.length && lines[lines.length - 1] === '') lines.pop();
  const errors: CsvProblem[] = [];
  if (lines.length === 0) return { ok: false, errors: [{ line: 1, column: null, value: null, problem: 'The mask is empty.', fix: 'One line per row of cells, codes 0, 1 or 2 separated by commas.' }] };
  if (lines.length > MAX_MASK_SIDE) return { ok: false, errors: [{ line: MAX_MASK_SIDE + 1, column: null, value: null, problem: `More than ${MAX_MASK_SIDE} rows.`, fix: 'Use coarser cells.' }] };
  const mask: MaskCode[][] = [];
  let width: number | null = null;
  lines.forEach((l, i) => {
    const line = i + 1;
    const cells = l.split(',').map((c) => c.trim());
    if (l === '') { errors.push({ line, column: null, value: '', problem: 'An empty line inside the grid.', fix: 'Remove the empty line or fill it with 0 for cells that are not habitat.' }); return; }
    if (cells.length > MAX_MASK_SIDE) errors.push({ line, column: null, value: null, problem: `More than ${MAX_MASK_SIDE} cells in a row.`, fix: 'Use coarser cells.' });
    if (width === null) width = cells.length;
    else if (cells.length !== width) errors.push({ line, column: null, value: l, problem: `Row has ${cells.length} cells, the first row has ${width}.`, fix: 'Give every row the same number of cells.' });
    const row: MaskCode[] = [];
    cells.forEach((c, j) => {
      if (c !== '0' && c !== '1' && c !== '2') errors.push({ line, column: `cell ${j + 1}`, value: c, problem: `"${c}" is not a cell code.`, fix: 'Use 0 (not habitat), 1 (fished habitat) or 2 (reserve).' });
      row.push((c === '2' ? 2 : c === '1' ? 1 : 0) as MaskCode);
    });
    mask.push(row);
  });
  if (!errors.length && !mask.some((r) => r.some((c) => c !== 0))) errors.push({ line: 1, column: null, value: null, problem: 'No cell is habitat.', fix: 'Mark the stock\'s habitat with 1 (fished) or 2 (reserve).' });
  return errors.length ? { ok: false, errors } : { ok: true, mask };
}
