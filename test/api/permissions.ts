// Who may call what: every API route with the roles allowed to reach it, written out by hand from
// the product's roles (assessor, board member, licensee, administrator), not read from the guards.
// The role matrix (role-matrix.spec.ts) calls every route as every role and as an anonymous caller
// and compares the answer with this table; a route the server has and this table lacks fails it.
// A new route needs a new row here, decided on its own merits.
import type { Role } from '../../api/users/user.schemas';

export type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

export interface Permission {
  method: Method;
  /** The full path with Express parameters, as mounted: `/api/runs/:id/cancel`. */
  path: string;
  /** The roles allowed through, or 'public' for a route anyone may call without signing in. */
  roles: readonly Role[] | 'public';
}

const ANY: readonly Role[] = ['admin', 'assessor', 'board', 'licensee'];
const WORKSPACE_READERS: readonly Role[] = ['assessor', 'board', 'admin'];

export const PERMISSIONS: readonly Permission[] = [
  // signing in and out
  { method: 'GET', path: '/api/auth/csrf', roles: 'public' },
  { method: 'POST', path: '/api/auth/sign-in', roles: 'public' },
  // the state of the database, queue and mail, for a proxy or a monitor that holds no account
  { method: 'GET', path: '/api/health', roles: 'public' },
  { method: 'POST', path: '/api/auth/sign-out', roles: ANY },
  { method: 'GET', path: '/api/auth/me', roles: ANY },
  // asking whether anyone is signed in is no error for a visitor
  { method: 'GET', path: '/api/auth/session', roles: 'public' },

  // Stripe calls the webhook without a session; its signature is the check
  { method: 'POST', path: '/api/stripe/webhook', roles: 'public' },

  // people: only the administrator manages accounts
  { method: 'GET', path: '/api/users', roles: ['admin'] },
  { method: 'POST', path: '/api/users', roles: ['admin'] },
  { method: 'PATCH', path: '/api/users/:id', roles: ['admin'] },
  { method: 'POST', path: '/api/users/:id/password', roles: ['admin'] },

  // regions and stocks are the shared vocabulary every role reads
  { method: 'GET', path: '/api/regions', roles: ANY },
  { method: 'GET', path: '/api/stocks', roles: ANY },
  { method: 'GET', path: '/api/stocks/:id', roles: ANY },

  // the assessor's workspace: the assessor writes; the board and the administrator read
  { method: 'GET', path: '/api/stocks/:stockId/datasets', roles: WORKSPACE_READERS },
  { method: 'POST', path: '/api/stocks/:stockId/datasets/check', roles: ['assessor'] },
  { method: 'POST', path: '/api/stocks/:stockId/datasets', roles: ['assessor'] },
  { method: 'GET', path: '/api/datasets/:id', roles: WORKSPACE_READERS },
  { method: 'GET', path: '/api/datasets/:id/csv', roles: WORKSPACE_READERS },

  { method: 'GET', path: '/api/stocks/:stockId/runs', roles: WORKSPACE_READERS },
  { method: 'POST', path: '/api/runs', roles: ['assessor'] },
  { method: 'GET', path: '/api/runs/:id', roles: WORKSPACE_READERS },
  { method: 'GET', path: '/api/runs/:id/events', roles: WORKSPACE_READERS },
  { method: 'POST', path: '/api/runs/:id/cancel', roles: ['assessor'] },

  { method: 'GET', path: '/api/stocks/:stockId/proposals', roles: WORKSPACE_READERS },
  { method: 'POST', path: '/api/proposals', roles: ['assessor'] },
  { method: 'GET', path: '/api/proposals/:id', roles: WORKSPACE_READERS },
  { method: 'PATCH', path: '/api/proposals/:id', roles: ['assessor'] },
  { method: 'POST', path: '/api/proposals/:id/submit', roles: ['assessor'] },
  { method: 'POST', path: '/api/proposals/:id/revise', roles: ['assessor'] },

  // the board: members vote and decide; the assessor answers in the discussion; the administrator
  // sets the rules (quorum, majority) and may watch, but never votes
  { method: 'GET', path: '/api/proposals/:proposalId/board', roles: WORKSPACE_READERS },
  { method: 'POST', path: '/api/proposals/:proposalId/board/comments', roles: ['board', 'assessor'] },
  { method: 'POST', path: '/api/proposals/:proposalId/board/votes', roles: ['board'] },
  { method: 'POST', path: '/api/proposals/:proposalId/board/decision', roles: ['board'] },
  { method: 'GET', path: '/api/board/proposals', roles: ['board', 'admin'] },
  { method: 'GET', path: '/api/board/rules', roles: ['board', 'admin', 'assessor'] },
  { method: 'PUT', path: '/api/board/rules', roles: ['admin'] },

  // published advisories: every role reads (a licensee only those of regions with access, which the
  // service decides); only the board supersedes one
  { method: 'GET', path: '/api/advisories', roles: ANY },
  { method: 'GET', path: '/api/advisories/:id', roles: ANY },
  { method: 'GET', path: '/api/advisories/:id/pdf', roles: ANY },
  { method: 'POST', path: '/api/advisories/:id/supersede', roles: ['board'] },

  // subscriptions are the licensee's own
  { method: 'GET', path: '/api/subscriptions', roles: ['licensee'] },
  { method: 'GET', path: '/api/subscriptions/plans', roles: ['licensee'] },
  { method: 'POST', path: '/api/subscriptions/checkout', roles: ['licensee'] },
  { method: 'POST', path: '/api/subscriptions/:id/cancel', roles: ['licensee'] },
  { method: 'POST', path: '/api/subscriptions/abandon-pending', roles: ['licensee'] },
  { method: 'PUT', path: '/api/subscriptions/mail-preference', roles: ['licensee'] },

  // the administrator's views of the mail folder and the audit trail
  { method: 'GET', path: '/api/admin/mail', roles: ['admin'] },
  { method: 'GET', path: '/api/admin/mail/:file', roles: ['admin'] },
  { method: 'POST', path: '/api/admin/mail/outbox/:id/resend', roles: ['admin'] },
  { method: 'GET', path: '/api/audit-events', roles: ['admin'] },
];
