import { QueryTypes } from 'sequelize';
import { DEMO_PASSWORD } from '../../seeders/demo-people';
import { spawnServer } from '../support/server-process';
import { demoEmail, testDb } from './support/test-app';

const PORT = Number(process.env.TEST_PORT_BASE ?? 4390) + 1;
const BASE = `http://127.0.0.1:${PORT}`;
const startServer = () => spawnServer(PORT, { CLIENT_DIR: '.data/no-client' });

function cookieOf(res: Response, name = 'brinkmark.sid'): string {
  return res.headers.getSetCookie().find((c) => c.startsWith(`${name}=`))!.split(';')[0]!;
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
        headers: { 'content-type': 'application/json', 'x-csrf-token': csrfToken, cookie: cookieOf(token, 'brinkmark.csrf') },
        body: JSON.stringify({ email: demoEmail('board'), password: DEMO_PASSWORD }),
      });
      expect(login.status).toBe(200);
      cookie = cookieOf(login);
    } finally {
      await first.stop();
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
      await second.stop();
    }
  });
});
