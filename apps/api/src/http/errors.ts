// Typed errors with codes, turned into RFC 9457 problem details in one place (problem-details.ts).
export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly title: string,
    readonly detail?: string,
    readonly errors?: { field: string; message: string }[],
    readonly code = 'error',
  ) {
    super(detail ?? title);
  }
}

export class ValidationError extends HttpError {
  constructor(errors: { field: string; message: string }[], detail = 'Some fields are not valid.') {
    super(400, 'Invalid request', detail, errors, 'validation');
  }
}

export class NotFoundError extends HttpError {
  constructor(what = 'resource') {
    super(404, 'Not found', `No such ${what}.`, undefined, 'not-found');
  }
}

export class UnauthorizedError extends HttpError {
  constructor(detail = 'Sign in to continue.') {
    super(401, 'Not signed in', detail, undefined, 'unauthorized');
  }
}

export class ForbiddenError extends HttpError {
  constructor(detail = 'Your role does not allow this.') {
    super(403, 'Not allowed', detail, undefined, 'forbidden');
  }
}

export class ConflictError extends HttpError {
  constructor(
    detail: string,
    readonly current?: unknown,
    errors?: { field: string; message: string }[],
  ) {
    super(409, 'Conflict', detail, errors, 'conflict');
  }
}

export class ServiceUnavailableError extends HttpError {
  constructor(detail = 'The database is not reachable. Try again shortly.') {
    super(503, 'Service unavailable', detail, undefined, 'unavailable');
  }
}
