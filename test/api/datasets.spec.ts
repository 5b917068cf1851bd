import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import type { Express } from 'express';
import { Dataset } from '../../api/datasets/dataset.model';
import { Stock } from '../../api/stocks/stock.model';
import { signIn, testApp } from './support/test-app';

const ROOT = resolve(import.meta.dirname, '..', '..');
const crabCsv = readFileSync(resolve(ROOT, 'seeders/data/blue-lip-crab.csv'), 'utf8');
const bad = (f: string) => readFileSync(resolve(ROOT, 'test/fixtures/bad-csv', f));

describe('dataset upload and versions', () => {
  let app: Express;
  let crabId: number;
  beforeAll(async () => {
    app = await testApp();
    crabId = (await Stock.findOne({ where: { code: 'blue-lip-crab' } }))!.id;
  });

  it('checks an uploaded file without storing it and returns the parsed table', async () => {
    const { agent, csrf } = await signIn(app, 'assessor');
    const before = await Dataset.count();
    const res = await agent.post(`/api/stocks/${crabId}/datasets/check`).set('x-csrf-token', csrf)
      .attach('file', Buffer.from(crabCsv), 'crab.csv').expect(200);
    expect(res.body.ok).toBeTrue();
    expect(res.body.header).toEqual(['year', 'catch', 'trap_survey']);
    expect(res.body.rows.length).toBe(36);
    expect(await Dataset.count()).toBe(before);
  });

  for (const [file, line, column] of [['13-negative-catch.csv', 7, 'catch'], ['12-missing-year.csv', 6, 'year'], ['16-catch-with-units.csv', 9, 'catch'], ['22-unterminated-quote.csv', 2, null]] as const) {
    it(`reports ${file} cell by cell on check, and refuses to store it`, async () => {
      const { agent, csrf } = await signIn(app, 'assessor');
      const check = await agent.post(`/api/stocks/${crabId}/datasets/check`).set('x-csrf-token', csrf).attach('file', bad(file), file).expect(200);
      expect(check.body.ok).toBeFalse();
      expect(check.body.errors[0].line).toBe(line);
      expect(check.body.errors[0].column).toBe(column);
      const before = await Dataset.count();
      const save = await agent.post(`/api/stocks/${crabId}/datasets`).set('x-csrf-token', csrf).send({ csv: bad(file).toString('utf8'), note: 'should not be saved' }).expect(422);
      expect(save.body.error.code).toBe('DATASET_ROWS_INVALID');
      expect(save.body.error.details.problems[0].line).toBe(line);
      expect(await Dataset.count()).toBe(before);
    });
  }

  it('refuses a file larger than 256 kB with 413', async () => {
    const { agent, csrf } = await signIn(app, 'assessor');
    const big = Buffer.from('year,catch,s\n' + '1990,1,1\n'.repeat(40_000));
    const res = await agent.post(`/api/stocks/${crabId}/datasets/check`).set('x-csrf-token', csrf).attach('file', big, 'big.csv');
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('BODY_TOO_LARGE');
  });

  it('refuses a linked predator-prey file for a single stock', async () => {
    const { agent, csrf } = await signIn(app, 'assessor');
    const pp = readFileSync(resolve(ROOT, 'seeders/data/sprat-ridge-cod.csv'), 'utf8');
    const res = await agent.post(`/api/stocks/${crabId}/datasets`).set('x-csrf-token', csrf).send({ csv: pp, note: 'wrong kind' }).expect(422);
    expect(res.body.error.code).toBe('DATASET_KIND_MISMATCH');
  });

  it('saves clean files as new versions, keeps every version, and gives each back as CSV', async () => {
    const { agent, csrf } = await signIn(app, 'assessor');
    const a = await agent.post(`/api/stocks/${crabId}/datasets`).set('x-csrf-token', csrf).send({ csv: crabCsv, note: 'Landings revised' }).expect(201);
    const edited = crabCsv.replace('1990,376.7', '1990,380');
    const b = await agent.post(`/api/stocks/${crabId}/datasets`).set('x-csrf-token', csrf).send({ csv: edited, note: 'Landings 1990 corrected' }).expect(201);
    expect(b.body.dataset.version).toBe(a.body.dataset.version + 1);
    const list = await agent.get(`/api/stocks/${crabId}/datasets`).expect(200);
    expect(list.body.datasets.map((d: { version: number }) => d.version)).toContain(a.body.dataset.version);
    expect(list.body.datasets[0].createdByName).toBe('Tomas Reyl');
    const csvA = await agent.get(`/api/datasets/${a.body.dataset.id}/csv`).expect(200);
    expect(csvA.headers['content-type']).toContain('text/csv');
    expect(csvA.text).toBe(crabCsv);
    expect((await agent.get(`/api/datasets/${b.body.dataset.id}/csv`)).text).toBe(edited);
  });

  it('needs a note and refuses unknown fields', async () => {
    const { agent, csrf } = await signIn(app, 'assessor');
    const res = await agent.post(`/api/stocks/${crabId}/datasets`).set('x-csrf-token', csrf).send({ csv: crabCsv, note: '', version: 99 }).expect(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['_', 'note']);
  });

  it('lets a board member read versions but not upload, and never a licensee', async () => {
    const board = await signIn(app, 'board');
    await board.agent.get(`/api/stocks/${crabId}/datasets`).expect(200);
    await board.agent.post(`/api/stocks/${crabId}/datasets`).set('x-csrf-token', board.csrf).send({ csv: crabCsv, note: 'board upload' }).expect(403);
    const licensee = await signIn(app, { email: 'office@inner-firth-potters.example', password: 'corran-firth-demo' });
    await licensee.agent.get(`/api/stocks/${crabId}/datasets`).expect(403);
  });
});
