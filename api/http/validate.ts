/** Request validation at the edge: one zod schema per endpoint, every problem reported at once. */
import type { RequestHandler } from 'express';
import type { ZodType } from 'zod';
import { FieldErrors, ValidationError } from './http-error';

/** Field path → messages, from a zod failure. */
export function fieldErrors(issues: { path: PropertyKey[]; message: string }[]): FieldErrors {
  const fields: FieldErrors = {};
  for (const issue of issues) {
    const key = issue.path.length ? issue.path.map(String).join('.') : '_';
    (fields[key] ??= []).push(issue.message);
  }
  return fields;
}

/** Replaces req.body with the parsed (whitelisted) value, or fails with VALIDATION_FAILED. */
export function validateBody(schema: ZodType): RequestHandler {
  return (req, _res, next) => {
    const parsed = schema.safeParse(req.body ?? {});
    if (!parsed.success) {
      next(new ValidationError('Some fields are not valid.', fieldErrors(parsed.error.issues)));
      return;
    }
    req.body = parsed.data;
    next();
  };
}

/** Parses a positive integer route parameter, or fails with VALIDATION_FAILED naming it. */
export function idParam(value: unknown, name = 'id'): number {
  const n = Number(value);
  if (!Number.isSafeInteger(n) || n <= 0) {
    throw new ValidationError(`Route parameter ${name} must be a positive whole number.`, { [name]: ['not a valid id'] });
  }
  return n;
}
