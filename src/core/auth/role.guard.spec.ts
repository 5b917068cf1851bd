import { signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter, Route, Router, UrlSegment, UrlTree } from '@angular/router';
import type { Role, UserView } from '../../../api/users/user.schemas';
import { AuthStore } from './auth-store';
import { roleGuard } from './role.guard';

describe('roleGuard', () => {
  function storeFor(role: Role | null): Partial<AuthStore> {
    const user = signal<UserView | null>(role ? ({ role } as UserView) : null);
    return {
      user: user.asReadonly(),
      signedIn: () => user() !== null,
      hasRole: (...roles: Role[]) => user() !== null && roles.includes(user()!.role),
    } as Partial<AuthStore>;
  }

  function run(role: Role | null, ...allowed: Role[]): boolean | UrlTree {
    TestBed.configureTestingModule({ providers: [provideRouter([]), { provide: AuthStore, useValue: storeFor(role) }] });
    const segments = [new UrlSegment('admin', {}), new UrlSegment('users', {})];
    return TestBed.runInInjectionContext(() => roleGuard(...allowed)({} as Route, segments)) as boolean | UrlTree;
  }

  it('lets an administrator into an admin-only route', () => {
    expect(run('admin', 'admin')).toBeTrue();
  });

  it('sends a signed-in board member away from an admin route to a page that names the page and who may open it', () => {
    const result = run('board', 'admin');
    expect(result instanceof UrlTree).toBeTrue();
    const tree = result as UrlTree;
    expect(tree.root.children['primary']!.segments.map((s) => s.path)).toEqual(['not-allowed']);
    expect(tree.queryParams).toEqual({ page: '/admin/users', roles: 'admin' });
  });

  it('sends an anonymous visitor to the sign-in page', () => {
    const result = run(null, 'assessor', 'board');
    expect(TestBed.inject(Router).serializeUrl(result as UrlTree)).toBe('/sign-in');
  });

  it('admits each listed role and no other', () => {
    const roles: Role[] = ['admin', 'assessor', 'board', 'licensee'];
    const admitted = roles.filter((r) => {
      TestBed.resetTestingModule();
      return run(r, 'assessor', 'board') === true;
    });
    expect(admitted).toEqual(['assessor', 'board']);
  });
});
