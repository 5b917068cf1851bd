import { spawnSync } from 'node:child_process';
import { resolve } from 'node:path';

const ROOT = resolve(import.meta.dirname, '..', '..', '..');
const cli = (...args: string[]) => spawnSync(process.execPath, ['--import', 'tsx', 'api/engine/cli/cli.ts', ...args], { cwd: ROOT, encoding: 'utf8' });

describe('engine command line: reserve', () => {
  it('prints persistence, the arctan critical length and a front speed below 2√(rD) on a short coast', () => {
    // critical length 2√(D/r)·arctan(√((F − r)/r)) (linearised problem); fronts approach 2√(rD) from below (Bramson 1983)
    const r = cli('reserve', '--params', 'r=0.5,K=100,D=2', '--coast', '60', '--reserve', '25:35', '--fishing', '1.5');
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.persists).toBeTrue();
    expect(Math.abs(out.criticalLength / (2 * 2 * Math.atan(Math.sqrt(2))) - 1)).toBeLessThan(0.01);
    expect(out.frontSpeed).toBeGreaterThan(1.4);
    expect(out.frontSpeed).toBeLessThan(2);
    expect(out.frontSpeedTheory).toBe(2);
  });

  it('says a reserve shorter than π√(D/r) in lethal surroundings does not persist', () => {
    // Kierstead & Slobodkin 1953: π√(2/0.5) = 2π ≈ 6.283 km
    const short = JSON.parse(cli('reserve', '--params', 'r=0.5,K=100,D=2', '--coast', '60', '--reserve', '27:33').stdout);
    const long = JSON.parse(cli('reserve', '--params', 'r=0.5,K=100,D=2', '--coast', '60', '--reserve', '26.8:33.2').stdout);
    expect(short.persists).toBeFalse();
    expect(long.persists).toBeTrue();
    expect(Math.abs(short.criticalLength / (2 * Math.PI) - 1)).toBeLessThan(0.01);
  });

  it('exits 2 naming a reserve off the coast or a missing parameter', () => {
    const off = cli('reserve', '--params', 'r=0.5,K=100,D=2', '--coast', '60', '--reserve', '50:70');
    expect(off.status).toBe(2);
    expect(off.stderr).toContain('--reserve must lie within the coast');
    expect(cli('reserve', '--params', 'r=0.5,K=100', '--coast', '60', '--reserve', '1:2').stderr).toContain('needs r > 0, K > 0 and D > 0');
  });
});
