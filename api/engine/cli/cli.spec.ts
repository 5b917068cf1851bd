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

  it('fits a linked file with both models compared and the fixed quantities listed', () => {
    const r = cli('fit', '--model', 'rosenzweig-macarthur', '--input', 'seeders/data/sprat-ridge-cod.csv', '--conversion', '0.2');
    expect(r.status).withContext(r.stderr).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.fixed[0].value).toBe(0.2);
    expect(out.comparison.map((c: { model: string }) => c.model)).toEqual(['rosenzweig-macarthur', 'lotka-volterra']);
    // Burnham & Anderson (2002): AIC = 2k − 2 lnL
    expect(out.aic).toBeCloseTo(2 * out.nParams - 2 * out.logLik, 8);
    expect(out.indices.length).toBe(2);
  });

  it('refuses a linked file under a single-stock model and a bad conversion efficiency, exit 2', () => {
    expect(cli('fit', '--model', 'schaefer', '--input', 'seeders/data/sprat-ridge-cod.csv').stderr).toContain('linked predator-prey file');
    const bad = cli('fold', '--model', 'rosenzweig-macarthur', '--input', 'seeders/data/sprat-ridge-cod.csv', '--conversion', '3');
    expect(bad.status).toBe(2);
    expect(bad.stderr).toContain('--conversion must be');
  });

  it('prints the food chain\'s Lyapunov exponents, largest first, and the horizon ln(tolerance/error)/λ₁', () => {
    const r = cli('horizon', '--model', 'food-chain', '--params', 'r=2,K=50000,yScale=20000,zScale=1000', '--error', '0.05');
    expect(r.status).withContext(r.stderr).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.lyapunov.length).toBe(3);
    expect(out.lyapunov[0]).toBeGreaterThan(out.lyapunov[1]);
    expect(out.lyapunov[1]).toBeGreaterThan(out.lyapunov[2]);
    // Hastings & Powell (1991) published shape is chaotic: λ₁ > 0, so the horizon is finite
    expect(out.lyapunov[0]).toBeGreaterThan(0);
    expect(out.horizonYears).toBeCloseTo(Math.log(out.tolerance / 0.05) / out.lyapunov[0], 8);
    expect(cli('horizon', '--model', 'food-chain', '--params', 'r=2,K=-1').stderr).toContain('K must be a positive number');
  });

  // Closed forms: the Allee cubic's maximum from g'(B) = 0 (Lewis & Kareiva 1993), the logistic under F
  // with its transcritical point at F = r and the catch fold at rK/4 (Schaefer 1954; Clark 1990).
  it('fold --params lists every bifurcation of given parameters without data', () => {
    const a = cli('fold', '--model', 'allee', '--params', 'r=0.5,K=1000,A=150');
    expect(a.status).toBe(0);
    const out = JSON.parse(a.stdout);
    const Bm = (1150 + Math.sqrt(1150 ** 2 - 3 * 150 * 1000)) / 3;
    const fold = out.bifurcations.find((b: { control: string }) => b.control === 'catch');
    expect(fold.kind).toBe('fold');
    expect(fold.at).toBeCloseTo(0.5 * Bm * (Bm / 150 - 1) * (1 - Bm / 1000), 8);
    expect(fold.biomass).toBeCloseTo(Bm, 5);
    const s = JSON.parse(cli('fold', '--model', 'schaefer', '--params', 'r=0.4,K=1000').stdout);
    expect(s.bifurcations).toEqual([
      { kind: 'fold', control: 'catch', at: jasmine.any(Number), biomass: jasmine.any(Number) },
      { kind: 'transcritical', control: 'F', at: jasmine.any(Number), biomass: 0 },
    ]);
    expect(s.bifurcations[0].at).toBeCloseTo(100, 8);
    expect(s.bifurcations[1].at).toBeCloseTo(0.4, 10);
    expect(s.noFold.F).toBeTrue();
  });

  it('fold --params names a missing or unknown parameter and exits 2', () => {
    const r = cli('fold', '--model', 'predation', '--params', 'r=0.5,K=10,c=1');
    expect(r.status).toBe(2);
    expect(r.stderr).toContain('missing a');
    expect(cli('fold', '--model', 'fox', '--params', 'r=0.5,K=10,A=2').stderr).toContain('not "A"');
  });
});
