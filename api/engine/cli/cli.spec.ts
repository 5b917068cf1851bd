import { spawnSync } from 'node:child_process';
import { resolve } from 'node:path';

const ROOT = resolve(import.meta.dirname, '..', '..', '..');
const cli = (...args: string[]) => spawnSync(process.execPath, ['--import', 'tsx', 'api/engine/cli/cli.ts', ...args], { cwd: ROOT, encoding: 'utf8' });

describe('engine command line', () => {
  it('prints a Schaefer fit as JSON with the fold harvest at rK/4 of the estimates', () => {
    const r = cli('fit', '--model', 'schaefer', '--input', 'seeders/data/blue-lip-crab.csv');
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout);
    const est = (n: string) => out.estimates.find((e: { name: string }) => e.name === n).value;
    expect(out.foldHarvest).toBeCloseTo((est('r') * est('K')) / 4, 4);
    expect(out.aic).toBeCloseTo(2 * 5 - 2 * out.logLik, 8);
    expect(out.convergence.converged).toBeTrue();
  });

  it('prints the fold table', () => {
    const r = cli('fold', '--model', 'fox', '--input', 'seeders/data/red-grouse.csv');
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.table.length).toBe(81);
    expect(out.table[80].h).toBeCloseTo(out.hStar, 6);
  });

  it('exits 2 naming the line and the problem for a malformed file', () => {
    const r = cli('fit', '--model', 'schaefer', '--input', 'test/fixtures/bad-csv/13-negative-catch.csv');
    expect(r.status).toBe(2);
    expect(r.stderr).toContain('line 7, catch: A catch cannot be negative.');
    expect(r.stdout).toBe('');
  });

  it('prints the diagnostics as JSON: Mohn\'s rho, MASE and runs-test p per survey, 95% profile intervals', () => {
    const r = cli('diagnose', '--model', 'schaefer', '--input', 'seeders/data/red-grouse.csv', '--peel', '3', '--jitter', '2');
    expect(r.status).withContext(r.stderr).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.peels).toBe(3);
    expect(Object.keys(out.mohnsRho).sort()).toEqual(['F', 'biomass']);
    expect(Number.isFinite(out.mohnsRho.biomass)).toBeTrue();
    expect(Object.keys(out.mase)).toEqual(['spring_count']);
    expect(out.runsTest.spring_count.p).toBeGreaterThan(0);
    expect(out.runsTest.spring_count.p).toBeLessThanOrEqual(1);
    for (const k of ['r', 'K', 'MSY', 'h*']) {
      const [lo, hi] = out.profiles[k];
      expect(lo).toBeLessThan(hi);
    }
    // the profile interval brackets the estimate it profiles (likelihood theory)
    const fit = JSON.parse(cli('fit', '--model', 'schaefer', '--input', 'seeders/data/red-grouse.csv').stdout);
    const rHat = fit.estimates.find((e: { name: string }) => e.name === 'r').value;
    expect(out.profiles.r[0]).toBeLessThan(rHat);
    expect(out.profiles.r[1]).toBeGreaterThan(rHat);
    expect(cli('diagnose', '--model', 'schaefer', '--input', 'seeders/data/red-grouse.csv', '--peel', '0').stderr).toContain('--peel must be');
  });

  it('exits 2 for an unknown model or option', () => {
    expect(cli('fit', '--model', 'gompertz', '--input', 'x.csv').stderr).toContain('--model must be one of');
    expect(cli('quota', '--model', 'schaefer', '--input', 'x.csv', '--colour', 'red').status).toBe(2);
  });
});
