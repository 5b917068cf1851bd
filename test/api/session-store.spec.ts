import { type ChildProcess, spawn } from 'node:child_process';
import { resolve } from 'node:path';
import { QueryTypes } from 'sequelize';
import { DEMO_PASSWORD } from '../../seeders/demo-people';
import { demoEmail, testDb } from './support/test-app';

const ROOT = resolve(import.meta.dirname, '..', '..');
const PORT = 4391;
const BASE = `http://127.0.0.1:${PORT}`;

/** Starts the real server process (api/server.ts) on the test database and waits until it answers. */
async function startServer(): Promise<ChildProcess> {
  const child = spawn(process.execPath, ['--import', 'tsx', 'api/server.ts'], {
    cwd: ROOT, env: { ...process.env, PORT: String(PORT), CLIENT_DIR: '.data/no-client' }, stdio: process.env.SHOW_SERVER ? 'inherit' : 'ignore',
  });
  const deadline = Date.now() + 20_000;
  while (Date.now() < deadline) {
    try {
      if ((await fetch(`${BASE}/api/auth/csrf`)).ok) return child;
    } catch { /* not listening yet */ }
    await new Promise((r) => setTimeout(r, 100));
  }
  child.kill('SIGKILL');
  throw new Error('server did not start');
}

async function stopServer(child: ChildProcess): Promise<void> {
  const exited = new Promise((r) => child.once('exit', r));
  child.kill('SIGTERM');
  await exited;
}

function cookieOf(res: Response): string {
  return res.headers.getSetCookie().find((c) => c.startsWith('brinkmark.sid='))!.split(';')[0]!;
}

describe('session store in MariaDB', () => {
  beforeAll(async () => {
    await testDb();
  });

  it('keeps a signed-in session across a restart of the server process', async () => {
    const first = await startServer();
    let cookie: string;
    try {
      const token = await fetch(`${BASE}/api/auth/csrf`);
      const { csrfToken } = await token.json() as { csrfToken: string };
      const login = await fetch(`${BASE}/api/auth/sign-in`, {
        method: 'POST',
        headers: { 'content-type': 'application/json', 'x-csrf-token': csrfToken, cookie: cookieOf(token) },
        body: JSON.stringify({ email: demoEmail('board'), password: DEMO_PASSWORD }),
      });
      expect(login.status).toBe(200);
      cookie = cookieOf(login);
    } finally {
      await stopServer(first);
    }

    const sid = decodeURIComponent(cookie.split('=')[1]!).slice(2).split('.')[0];
    const { sequelize } = await testDb();
    const rows = await sequelize.query<{ data: string }>('SELECT data FROM sessions WHERE sid = ?', { replacements: [sid], type: QueryTypes.SELECT });
    expect(rows.length).toBe(1);
    expect(JSON.parse(rows[0]!.data).passport.user).toBeGreaterThan(0);

    const second = await startServer();
    try {
      const me = await fetch(`${BASE}/api/auth/me`, { headers: { cookie } });
      expect(me.status).toBe(200);
      expect(((await me.json()) as { user: { email: string } }).user.email).toBe(demoEmail('board'));
    } finally {
      await stopServer(second);
    }
  });
});
