/** CSRF defence for cookie sessions: a synchroniser token kept in the session, sent back in a header. */
import { csrfSync } from 'csrf-sync';

export const CSRF_HEADER = 'x-csrf-token';

export const { csrfSynchronisedProtection: csrfProtection, generateToken: generateCsrfToken } = csrfSync({
  getTokenFromRequest: (req) => req.get(CSRF_HEADER) ?? undefined,
  errorConfig: { statusCode: 403, code: 'EBADCSRFTOKEN', message: 'invalid csrf token' },
});
