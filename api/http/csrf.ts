/**
 * CSRF defence for cookie sessions. A signed-in session keeps a synchroniser token (csrf-sync) that
 * the client sends back in a header. An anonymous caller (who can only sign in) gets a signed
 * double-submit token instead: a random nonce in a SameSite=Strict cookie and, in the token, the
 * nonce with its HMAC. Nothing is stored for anonymous callers, so they never grow the session table.
 */
import { createHmac, randomBytes, timingSafeEqual } from 'node:crypto';
import { csrfSync } from 'csrf-sync';
import type { Request, RequestHandler, Response } from 'express';

export const CSRF_HEADER = 'x-csrf-token';
export const ANON_CSRF_COOKIE = 'brinkmark.csrf';
const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

const sync = csrfSync({
  getTokenFromRequest: (req) => req.get(CSRF_HEADER) ?? undefined,
  errorConfig: { statusCode: 403, code: 'EBADCSRFTOKEN', message: 'invalid csrf token' },
});

export interface CsrfOptions {
  secret: string;
  secureCookie: boolean;
}

const hasUser = (req: Request) => Boolean((req.session as { passport?: { user?: unknown } } | undefined)?.passport?.user);

function sign(secret: string, nonce: string): string {
  return createHmac('sha256', secret).update(`anonymous-csrf:${nonce}`).digest('base64url');
}

function cookieValue(req: Request, name: string): string | undefined {
  for (const part of (req.get('cookie') ?? '').split(';')) {
    const eq = part.indexOf('=');
    if (eq > 0 && part.slice(0, eq).trim() === name) return part.slice(eq + 1).trim();
  }
  return undefined;
}

function sameText(a: string, b: string): boolean {
  const x = Buffer.from(a);
  const y = Buffer.from(b);
  return x.length === y.length && timingSafeEqual(x, y);
}

function anonymousTokenValid(req: Request, secret: string): boolean {
  const [kind, nonce, mac] = (req.get(CSRF_HEADER) ?? '').split('.');
  const cookie = cookieValue(req, ANON_CSRF_COOKIE);
  return kind === 'a' && !!nonce && !!mac && !!cookie && sameText(nonce, cookie) && sameText(mac, sign(secret, nonce));
}

const csrfError = () => Object.assign(new Error('invalid csrf token'), { code: 'EBADCSRFTOKEN', status: 403 });

/** The CSRF check and token issuer of one application. */
export function createCsrf(options: CsrfOptions) {
  const protection: RequestHandler = (req, res, next) => {
    if (SAFE_METHODS.has(req.method)) return next();
    if (hasUser(req)) return sync.csrfSynchronisedProtection(req, res, next);
    return anonymousTokenValid(req, options.secret) ? next() : next(csrfError());
  };

  /** The token for this caller: the session's (signed in) or a fresh signed nonce in a cookie (anonymous). */
  const generateToken = (req: Request, res: Response, overwrite = false): string => {
    if (hasUser(req)) return sync.generateToken(req, overwrite);
    const existing = cookieValue(req, ANON_CSRF_COOKIE);
    const nonce = existing && /^[A-Za-z0-9_-]{22,64}$/.test(existing) && !overwrite ? existing : randomBytes(18).toString('base64url');
    res.cookie(ANON_CSRF_COOKIE, nonce, { httpOnly: true, sameSite: 'strict', secure: options.secureCookie, path: '/api' });
    return `a.${nonce}.${sign(options.secret, nonce)}`;
  };

  return { protection, generateToken };
}

export type Csrf = ReturnType<typeof createCsrf>;
