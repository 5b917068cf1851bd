/** The one error handler: every failure leaves as {"error": {code, message, fields?}}. */
import type { ErrorRequestHandler, RequestHandler } from 'express';
import { HttpError } from './http-error';

interface ErrorBody {
  error: { code: string; message: string; fields?: Record<string, string[]>; details?: unknown; requestId?: string };
}

function fromKnown(err: unknown): { status: number; body: ErrorBody } | null {
  if (err instanceof HttpError) {
    return { status: err.status, body: { error: { code: err.code, message: err.message, fields: err.fields, details: err.details } } };
  }
  const e = err as { status?: number; type?: string; code?: string } | null;
  if (e?.code === 'EBADCSRFTOKEN') {
    return { status: 403, body: { error: { code: 'CSRF_TOKEN_INVALID', message: 'The security token is missing or out of date. Reload the page and try again.' } } };
  }
  if (e?.type === 'entity.parse.failed') {
    return { status: 400, body: { error: { code: 'BODY_MALFORMED', message: 'The request body is not valid JSON.' } } };
  }
  if (e?.type === 'entity.too.large' || e?.code === 'LIMIT_FILE_SIZE') {
    return { status: 413, body: { error: { code: 'BODY_TOO_LARGE', message: 'The request or file is larger than allowed.' } } };
  }
  return null;
}

export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  const known = fromKnown(err);
  if (known) {
    res.status(known.status).json(known.body);
    return;
  }
  const requestId = String(res.getHeader('X-Request-Id') ?? '');
  console.error(`[${requestId}] ${req.method} ${req.originalUrl}`, err);
  res.status(500).json({ error: { code: 'INTERNAL', message: 'Something went wrong on the server.', requestId } });
};

/** 404 for any /api path that no route matched. */
export const apiNotFound: RequestHandler = (req, res) => {
  res.status(404).json({ error: { code: 'ROUTE_NOT_FOUND', message: `No API route ${req.method} ${req.path}.` } });
};
