// Hostile and loose uploads: a very wide file is refused with a specific error, the check runs off the
// request thread with a time limit, and only plain decimals within a sane range are stored.
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import type { Express } from 'express';
import { CsvChecker } from '../../api/datasets/csv-checker';
import { Dataset } from '../../api/datasets/dataset.model';
import { MAX_COLUMNS, MAX_LINE_CHARS } from '../../api/engine/data/csv';
import { Stock } from '../../api/stocks/stock.model';
import { signIn, testApp } from './support/test-app';

const ROOT = resolve(import.meta.dirname, '..', '..');
const crabCsv = readFileSync(resolve(ROOT, 'seeders/data/blue-lip-crab.csv'), 'utf8');

/** The crab file with the catch of its third data row (file line 4) replaced. */
function withCatch(text: string): string {
  const lines = crabCsv.split('\n');
  const cells = lines[3]!.split(',');
  cells[1] = text;
  lines[3] = cells.join(',');
  return lines.join('\n');
}

describe('hostile uploads', () => {
  let app: Express;
  let crabId: number;
  beforeAll(async () => {
    app = await testApp();
    crabId = (await Stock.findOne({ where: { code: 'blue-lip-crab' } }))!.id;
  });

  it('refuses a 10,000-column file with the column limit named, and stores nothing', async () => {
    const { agent, csrf } = await signIn(app, 'assessor');
    const header = ['year', 'catch', ...Array.from({ length: 9998 }, (_, i) => `s${i}`)].join(',');
    const row = (y: number) => [y, 5, ...Array.from({ length: 9998 }, () => '1')].join(',');
    const wide = [header, ...Array.from({ length: 9 }, (_, i) => row(1990 + i))].join('\n');
    expect(wide.length).toBeGreaterThan(200_000);
    const before = await Dataset.count();
    const check = await agent.post(`/api/stocks/${crabId}/datasets/check`).set('x-csrf-token', csrf).attach('file', Buffer.from(wide), 'wide.csv').expect(200);
    expect(check.body.ok).toBeFalse();
    expect(check.body.errors[0].problem).toContain(String(MAX_LINE_CHARS));
    const save = await agent.post(`/api/stocks/${crabId}/datasets`).set('x-csrf-token', csrf).send({ csv: wide, note: 'wide' }).expect(422);
    expect(save.body.error.code).toBe('DATASET_ROWS_INVALID');
    expect(await Dataset.count()).toBe(before);
  });

  it('names the column limit for a header that is wide but in short lines', async () => {
    const { agent, csrf } = await signIn(app, 'assessor');
    const cols = ['year', 'catch', ...Array.from({ length: MAX_COLUMNS }, (_, i) => `s${i}`)];
    const csv = [cols.join(','), cols.map(() => '1').join(',')].join('\n');
    const check = await agent.post(`/api/stocks/${crabId}/datasets/check`).set('x-csrf-token', csrf).attach('file', Buffer.from(csv), 'wide.csv').expect(200);
    expect(check.body.errors[0].problem).toContain(`more than ${MAX_COLUMNS} columns`);
  });

  it('answers a check that runs past its time limit with DATASET_CHECK_TIMEOUT while the server thread stays free', async () => {
    const stalling = new CsvChecker(new URL('../fixtures/stalling-csv-worker.ts', import.meta.url), 300);
    try {
      let ticks = 0;
      const ticker = setInterval(() => ticks++, 10);
      const err = await stalling.check(crabCsv).then(() => null, (e: { code?: string }) => e);
      clearInterval(ticker);
      expect(err?.code).toBe('DATASET_CHECK_TIMEOUT');
      // the event loop kept turning while the worker sat on the file
      expect(ticks).toBeGreaterThan(5);
    } finally {
      await stalling.close();
    }
  });

  for (const loose of ['0x7C6', '0b101', '1.99e3', '+514.6', '1e308', 'Infinity', '1,5']) {
    it(`refuses the catch value ${loose} as a row-level error and stores nothing`, async () => {
      const { agent, csrf } = await signIn(app, 'assessor');
      const before = await Dataset.count();
      const csv = loose.includes(',') ? withCatch(`"${loose}"`) : withCatch(loose);
      const save = await agent.post(`/api/stocks/${crabId}/datasets`).set('x-csrf-token', csrf).send({ csv, note: 'loose number' }).expect(422);
      expect(save.body.error.code).toBe('DATASET_ROWS_INVALID');
      const problem = save.body.error.details.problems[0];
      expect(problem.line).toBe(4);
      expect(problem.column).toBe('catch');
      expect(await Dataset.count()).toBe(before);
    });
  }

  it('refuses a plain catch beyond the sane range for the column, naming the limit', async () => {
    const { agent, csrf } = await signIn(app, 'assessor');
    const save = await agent.post(`/api/stocks/${crabId}/datasets`).set('x-csrf-token', csrf).send({ csv: withCatch('2000000000'), note: 'huge' }).expect(422);
    expect(save.body.error.details.problems[0].problem).toContain('Too large for a catch');
  });

  it('still stores plain decimals such as 514.6, .5 and 1990', async () => {
    const { agent, csrf } = await signIn(app, 'assessor');
    for (const ok of ['514.6', '.5', '1990']) {
      const check = await agent.post(`/api/stocks/${crabId}/datasets/check`).set('x-csrf-token', csrf).attach('file', Buffer.from(withCatch(ok)), 'ok.csv').expect(200);
      expect(check.body.ok).withContext(ok).toBeTrue();
    }
  });
});
