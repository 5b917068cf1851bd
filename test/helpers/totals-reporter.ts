// Writes the server run's totals to .data/jasmine-result.json for the closing summary line. A spec
// that did not run (xit, xdescribe, pending(), or everything outside an fit/fdescribe) counts as
// skipped, and the test script fails the run when any are skipped.
import { mkdirSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';

const totals = { passed: 0, failed: 0, skipped: 0, error: false };
jasmine.getEnv().addReporter({
  specDone: (r) => {
    if (r.status === 'passed') totals.passed++;
    else if (r.status === 'failed') totals.failed++;
    else totals.skipped++;
  },
  suiteDone: (r) => {
    if (r.status === 'failed') totals.failed++;
  },
  jasmineDone: (r) => {
    // 'incomplete' is a focused run (fit/fdescribe): as much a failure as a skip
    if (r.overallStatus === 'incomplete') totals.skipped = Math.max(totals.skipped, 1);
    if (r.overallStatus === 'failed' && totals.failed === 0) totals.error = true;
    const dir = resolve(import.meta.dirname, '..', '..', '.data');
    mkdirSync(dir, { recursive: true });
    writeFileSync(join(dir, process.env.JASMINE_RESULT_FILE ?? 'jasmine-result.json'), JSON.stringify(totals));
  },
});
