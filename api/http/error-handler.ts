/** The one error handler: every failure leaves as {"error": {code, message, fields?}}. */
import type { ErrorRequestHandler, RequestHandler } from 'express';
import { isDatabaseUnavailable } from '../health/database-state';
import { HttpError } from './http-error';

interface ErrorBody {
  error: { code: string; message: string; fields?: Record<string, string[]>; details?: unknown; requestId?: string };
}

type Known = { status: number; body: ErrorBody; log?: string };

const known = (status: number, code: string, message: string, log?: string): Known => ({ status, body: { error: { code, message } }, log });

/** Errors raised by the body parsers and the router before any route runs (all 4xx, never the server's fault). */
function fromParser(e: { status?: number; type?: string; code?: string; name?: string; message?: string }): Known | null {
  switch (e.type) {
    case 'entity.parse.failed': return known(400, 'BODY_MALFORMED', 'The request body is not valid JSON.');
    case 'entity.too.large': return known(413, 'BODY_TOO_LARGE', 'The request or file is larger than allowed.');
    case 'charset.unsupported': return known(415, 'CHARSET_UNSUPPORTED', 'The request body must be UTF-8 (send charset=utf-8 or no charset).');
    case 'encoding.unsupported': return known(415, 'ENCODING_UNSUPPORTED', 'The request body encoding is not supported (send identity, gzip, deflate or br).');
    case 'request.size.invalid': case 'request.aborted': return known(400, 'BODY_INCOMPLETE', 'The request body ended early or does not match its length.');
    case 'stream.encoding.set': case 'stream.not.readable': return known(400, 'BODY_UNREADABLE', 'The request body could not be read.');
    default: break;
  }
  if (e.code === 'LIMIT_FILE_SIZE') return known(413, 'BODY_TOO_LARGE', 'The request or file is larger than allowed.');
  if (e.code === 'Z_DATA_ERROR' || e.code === 'Z_BUF_ERROR' || e.code === 'ERR_PADDING_1' || /incorrect header check|unexpected end of file/.test(e.message ?? '')) {
    return known(400, 'BODY_ENCODING_INVALID', 'The compressed request body is corrupt.');
  }
  if (e instanceof URIError || (e.status === 400 && /decode/i.test(e.message ?? ''))) {
    return known(400, 'URL_MALFORMED', 'The address contains a malformed %-escape.');
  }
  if (typeof e.code === 'string' && e.code.startsWith('LIMIT_')) return known(400, 'UPLOAD_INVALID', `The upload was refused: ${e.message ?? e.code}.`);
  // any other client error a library marked as safe to show (http-errors convention)
  if (typeof e.status === 'number' && e.status >= 400 && e.status < 500) return known(e.status, 'REQUEST_INVALID', 'The request could not be read.');
  return null;
}

function fromKnown(err: unknown): Known | null {
  if (err instanceof HttpError) {
    return { status: err.status, body: { error: { code: err.code, message: err.message, fields: err.fields, details: err.details } } };
  }
  const e = err as { status?: number; type?: string; code?: string; name?: string; message?: string } | null;
  if (!e) return null;
  if (e.code === 'EBADCSRFTOKEN') {
    return known(403, 'CSRF_TOKEN_INVALID', 'The security token is missing or out of date. Reload the page and try again.');
  }
  if (isDatabaseUnavailable(err)) {
    return known(503, 'DATABASE_UNAVAILABLE', 'The database is not reachable at the moment; nothing was changed. Try again in a minute.', `database unavailable: ${e.message ?? ''}`);
  }
  return fromParser(e);
}

export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  const requestId = String(res.getHeader('X-Request-Id') ?? '');
  const k = fromKnown(err);
  if (k) {
    if (k.log) console.error(`[${requestId}] ${req.method} ${req.originalUrl}: ${k.log}`);
    if (k.status === 503) res.setHeader('Retry-After', '5');
    if (res.headersSent) return void res.end();
    res.status(k.status).json(k.body);
    return;
  }
  console.error(`[${requestId}] ${req.method} ${req.originalUrl}`, err);
  if (res.headersSent) return void res.end();
  res.status(500).json({ error: { code: 'INTERNAL', message: 'Something went wrong on the server.', requestId } });
};

/** 404 for any /api path that no route matched. */
export const apiNotFound: RequestHandler = (req, res) => {
  res.status(404).json({ error: { code: 'ROUTE_NOT_FOUND', message: `No API route ${req.method} ${req.path}.` } });
};
