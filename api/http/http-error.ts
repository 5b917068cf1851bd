/** Typed errors that services throw; the error handler maps each to one JSON envelope. */
export type FieldErrors = Record<string, string[]>;

export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: FieldErrors,
    readonly details?: unknown,
  ) {
    super(message);
  }
}

export class ValidationError extends HttpError {
  constructor(message: string, fields?: FieldErrors, details?: unknown) {
    super(400, 'VALIDATION_FAILED', message, fields, details);
  }
}

export class NotSignedInError extends HttpError {
  constructor() {
    super(401, 'NOT_SIGNED_IN', 'Sign in to continue.');
  }
}

export class ForbiddenError extends HttpError {
  constructor(message = 'Your role does not allow this action.') {
    super(403, 'FORBIDDEN', message);
  }
}

export class NotFoundError extends HttpError {
  constructor(what: string) {
    super(404, 'NOT_FOUND', `${what} was not found.`);
  }
}

export class ConflictError extends HttpError {
  constructor(code: string, message: string) {
    super(409, code, message);
  }
}
