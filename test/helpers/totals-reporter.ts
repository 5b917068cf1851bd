// Writes the server run's totals to .data/jasmine-result.json for the closing summary line.
import { mkdirSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';

const totals = { passed: 0, failed: 0, error: false };
jasmine.getEnv().addReporter({
  specDone: (r) => {
    if (r.status === 'passed') totals.passed++;
    else if (r.status === 'failed') totals.failed++;
  },
  suiteDone: (r) => {
    if (r.status === 'failed') totals.failed++;
  },
  jasmineDone: (r) => {
    if (r.overallStatus === 'failed' && totals.failed === 0) totals.error = true;
    const dir = resolve(import.meta.dirname, '..', '..', '.data');
    mkdirSync(dir, { recursive: true });
    writeFileSync(join(dir, process.env.JASMINE_RESULT_FILE ?? 'jasmine-result.json'), JSON.stringify(totals));
  },
});
