import { spawnSync } from 'node:child_process';
import { resolve } from 'node:path';

const ROOT = resolve(import.meta.dirname, '..', '..', '..');
const cli = (...args: string[]) => spawnSync(process.execPath, ['--import', 'tsx', 'api/engine/cli/cli.ts', ...args], { cwd: ROOT, encoding: 'utf8' });

describe('engine command line: cascade', () => {
  it('prints the Ricker doublings against productivity with the first at r = 2 (May 1976)', () => {
    const r = cli('cascade', '--model', 'ricker', '--params', 'r=2,K=1000', '--productivity', '1.5:3:0.025');
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.doublings[0]).toBeCloseTo(2, 9);
    expect(out.doublings.length).toBeGreaterThanOrEqual(6);
    expect(out.chaosOnset).toBeGreaterThan(out.doublings[out.doublings.length - 1]);
    expect(out.diagram).toBeUndefined();
  });

  it('prints harvest-rate doublings at u = 1 − e^(2 − r) and the collapse rate 1 − e^(−r)', () => {
    // r_eff = r + ln(1 − u) for the escapement map (derivation in cascade.spec.ts)
    const r = cli('cascade', '--model', 'ricker', '--params', 'r=2.5,K=10', '--harvest', '0:0.9:0.01', '--diagram');
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.doublings[0]).toBeCloseTo(1 - Math.exp(-0.5), 9);
    expect(out.collapseAt).toBeCloseTo(1 - Math.exp(-2.5), 12);
    expect(out.diagram.length).toBe(91);
  });

  it('exits 2 naming the bad parameter or range', () => {
    const bad = cli('cascade', '--model', 'ricker', '--params', 'r=2,K=-5');
    expect(bad.status).toBe(2);
    expect(bad.stderr).toContain('K must lie in');
    expect(cli('cascade', '--model', 'ricker', '--params', 'r=2,K=5', '--harvest', '0.5:0.2').stderr).toContain('TO must be larger than FROM');
    expect(cli('cascade', '--model', 'ricker', '--params', 'r=two,K=5').stderr).toContain('"r=two" is not NAME=NUMBER');
    expect(cli('cascade', '--model', 'gompertz', '--params', 'r=2').stderr).toContain('--model must be one of');
  });
});
