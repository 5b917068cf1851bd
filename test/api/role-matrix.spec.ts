// Every API route the server has, called by every role and by an anonymous caller, answered as the
// hand-written permission table (permissions.ts) says: the table, not the route's own guard, is the
// expectation, so a guard widened or narrowed by mistake fails here. A route missing from the table,
// a row for a route that no longer exists, and a route without exactly one guard fail too.
import type { Express } from 'express';
import type { ApiMount } from '../../api/app';
import type { RoleGuard } from '../../api/http/auth';
import { ROLES } from '../../api/users/user.schemas';
import { PERMISSIONS, type Permission } from './permissions';
import { anonymous, signIn, testApp } from './support/test-app';

interface ServedRoute {
  method: string;
  path: string;
  guards: number;
}

interface RouterLayer {
  route?: { path: string; methods: Record<string, boolean>; stack: { handle: Partial<RoleGuard> }[] };
}

/** The routes the app serves under /api, read from the routers `apiMounts()` lists. */
function servedRoutes(app: Express): ServedRoute[] {
  const rows: ServedRoute[] = [];
  for (const mount of app.locals.apiMounts as ApiMount[]) {
    for (const layer of (mount.router as unknown as { stack: RouterLayer[] }).stack) {
      if (!layer.route) continue;
      const guards = layer.route.stack.filter((s) => s.handle.allowedRoles !== undefined).length;
      const path = (mount.base + layer.route.path).replace(/\/$/, '');
      for (const method of Object.keys(layer.route.methods)) rows.push({ method: method.toUpperCase(), path, guards });
    }
  }
  return rows;
}

const key = (r: { method: string; path: string }) => `${r.method} ${r.path}`;
const concrete = (path: string) => path.replace(/:[A-Za-z]+/g, '1');

async function call(agent: Awaited<ReturnType<typeof anonymous>>['agent'], csrf: string, row: Permission) {
  return agent[row.method.toLowerCase() as 'get'](concrete(row.path)).set('x-csrf-token', csrf).send({});
}

describe('role matrix over every API route', () => {
  let app: Express;
  let served: ServedRoute[];
  beforeAll(async () => {
    app = await testApp();
    served = servedRoutes(app);
  });

  it('has a permission row for every route the server serves', () => {
    const table = new Set(PERMISSIONS.map(key));
    const missing = served.filter((r) => !table.has(key(r))).map(key);
    expect(served.length).toBeGreaterThan(8);
    expect(missing).withContext('routes with no row in test/api/permissions.ts').toEqual([]);
  });

  it('has no permission row for a route the server does not serve', () => {
    const live = new Set(served.map(key));
    const stale = PERMISSIONS.filter((p) => !live.has(key(p))).map(key);
    expect(stale).withContext('rows in test/api/permissions.ts for routes that do not exist').toEqual([]);
  });

  it('lists each route once in the permission table', () => {
    const keys = PERMISSIONS.map(key);
    expect(keys.filter((k, i) => keys.indexOf(k) !== i)).toEqual([]);
  });

  it('gives every route exactly one guard, so nothing is reachable by default', () => {
    const wrong = served.filter((r) => r.guards !== 1).map((r) => `${key(r)} (${r.guards} guards)`);
    expect(wrong).toEqual([]);
  });

  it('lets an anonymous caller reach only the public routes; every other route answers 401', async () => {
    for (const row of PERMISSIONS) {
      const { agent, csrf } = await anonymous(app);
      const res = await call(agent, csrf, row);
      const label = `anonymous ${key(row)} → ${res.status} ${res.body?.error?.code ?? ''}`;
      if (row.roles === 'public') expect(res.status).withContext(label).not.toBe(401);
      else {
        expect(res.status).withContext(label).toBe(401);
        expect(res.body?.error?.code).withContext(label).toBe('NOT_SIGNED_IN');
      }
    }
  }, 180_000);

  for (const role of ROLES) {
    it(`allows the ${role} role exactly the routes the permission table gives it`, async () => {
      // one session for the role; signing out gets a session of its own
      const session = await signIn(app, role);
      for (const row of PERMISSIONS) {
        const { agent, csrf } = row.path === '/api/auth/sign-out' ? await signIn(app, role) : session;
        const res = await call(agent, csrf, row);
        const label = `${role} ${key(row)} → ${res.status} ${res.body?.error?.code ?? ''}`;
        if (row.roles === 'public' || row.roles.includes(role)) {
          // allowed: never turned away for the role (a business rule such as NOT_SUBSCRIBED may still say 403)
          expect(res.status).withContext(label).not.toBe(401);
          expect(res.body?.error?.code).withContext(label).not.toBe('FORBIDDEN');
        } else {
          expect(res.status).withContext(label).toBe(403);
          expect(res.body?.error?.code).withContext(label).toBe('FORBIDDEN');
        }
      }
    }, 180_000);
  }

  it('answers an unknown API path with 404 ROUTE_NOT_FOUND once signed in', async () => {
    const { agent } = await signIn(app, 'admin');
    const res = await agent.get('/api/no-such-thing').expect(404);
    expect(res.body.error.code).toBe('ROUTE_NOT_FOUND');
  });
});
