// Every API route that exists, for every role and for an anonymous caller: allowed or denied as its
// guard declares, and no route without a guard (deny by default).
import type { Express } from 'express';
import type { ApiMount } from '../../api/app';
import type { RoleGuard } from '../../api/http/auth';
import { ROLES, type Role } from '../../api/users/user.schemas';
import { anonymous, signIn, testApp } from './support/test-app';

interface RouteRow {
  method: string;
  path: string;
  allowed: readonly Role[] | 'public';
}

interface RouterLayer {
  route?: { path: string; methods: Record<string, boolean>; stack: { handle: Partial<RoleGuard> }[] };
}

function routeTable(app: Express): RouteRow[] {
  const rows: RouteRow[] = [];
  for (const mount of app.locals.apiMounts as ApiMount[]) {
    for (const layer of (mount.router as unknown as { stack: RouterLayer[] }).stack) {
      if (!layer.route) continue;
      const guards = layer.route.stack.map((s) => s.handle.allowedRoles).filter((a) => a !== undefined);
      if (guards.length !== 1) throw new Error(`${mount.base}${layer.route.path} has ${guards.length} role guards`);
      for (const method of Object.keys(layer.route.methods)) {
        rows.push({ method: method.toUpperCase(), path: (mount.base + layer.route.path).replace(/\/$/, ''), allowed: guards[0]! });
      }
    }
  }
  return rows;
}

function concrete(path: string): string {
  return path.replace(/:[A-Za-z]+/g, '1');
}

describe('role matrix over every API route', () => {
  let app: Express;
  let rows: RouteRow[];
  beforeAll(async () => {
    app = await testApp();
    rows = routeTable(app);
  });

  it('finds the routes and exactly the three public ones', () => {
    expect(rows.length).toBeGreaterThan(8);
    const pub = rows.filter((r) => r.allowed === 'public').map((r) => `${r.method} ${r.path}`).sort();
    expect(pub).toEqual(['GET /api/auth/csrf', 'POST /api/auth/sign-in', 'POST /api/stripe/webhook']);
  });

  it('denies every guarded route to an anonymous caller with 401', async () => {
    for (const row of rows.filter((r) => r.allowed !== 'public')) {
      const { agent, csrf } = await anonymous(app);
      const res = await agent[row.method.toLowerCase() as 'get'](concrete(row.path)).set('x-csrf-token', csrf).send({});
      expect(res.status).withContext(`${row.method} ${row.path}`).toBe(401);
    }
  });

  for (const role of ROLES) {
    it(`allows and denies each route for the ${role} role as declared`, async () => {
      for (const row of rows.filter((r) => r.allowed !== 'public')) {
        const { agent, csrf } = await signIn(app, role);
        const res = await agent[row.method.toLowerCase() as 'get'](concrete(row.path)).set('x-csrf-token', csrf).send({});
        const label = `${role} ${row.method} ${row.path} → ${res.status} ${res.body?.error?.code ?? ''}`;
        if ((row.allowed as readonly Role[]).includes(role)) {
          // allowed: never turned away for the role (a business rule such as NOT_SUBSCRIBED may still say 403)
          expect(res.status).withContext(label).not.toBe(401);
          expect(res.body?.error?.code).withContext(label).not.toBe('FORBIDDEN');
        } else {
          expect(res.status).withContext(label).toBe(403);
          expect(res.body.error.code).withContext(label).toBe('FORBIDDEN');
        }
      }
    });
  }

  it('answers an unknown API path with 404 ROUTE_NOT_FOUND once signed in', async () => {
    const { agent } = await signIn(app, 'admin');
    const res = await agent.get('/api/no-such-thing').expect(404);
    expect(res.body.error.code).toBe('ROUTE_NOT_FOUND');
  });
});
