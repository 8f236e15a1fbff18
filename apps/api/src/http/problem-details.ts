// The one error handler: every failure leaves as application/problem+json (RFC 9457).
import type { ErrorRequestHandler, RequestHandler } from 'express';
import type { ProblemDetails } from '@bumperline/contracts/common';
import { redactUrl } from './logger.ts';
import { Conflict, InvalidInput, NotAllowed, NotFound } from '../services/workflow-errors.ts';
import { ConflictError, ForbiddenError, HttpError, NotFoundError, ServiceUnavailableError, ValidationError } from './errors.ts';

export function sendProblem(res: Parameters<RequestHandler>[1], problem: ProblemDetails & Record<string, unknown>) {
  res.status(problem.status).type('application/problem+json').json(problem);
}

const PROBLEM_BASE = 'https://bumperline.example/problems/';

// Connection failures from pg/node mean the database is down: 503, not 500.
const DB_DOWN_CODES = new Set(['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', '57P01', '57P02', '57P03', '08006', '08001']);
function isDatabaseDown(err: unknown): boolean {
  for (let e: unknown = err, depth = 0; e && depth < 4; e = (e as { cause?: unknown }).cause, depth++) {
    const code = (e as { code?: string }).code;
    const msg = (e as { message?: string }).message ?? '';
    if ((code && DB_DOWN_CODES.has(code)) || /Connection terminated|timeout exceeded when trying to connect/.test(msg)) {
      return true;
    }
  }
  return false;
}

export const notFoundHandler: RequestHandler = (req) => {
  throw new NotFoundError(`route ${req.method} ${req.path}`);
};

/** A workflow's refusal (services/workflow-errors.ts) as the HTTP error it means. */
function fromWorkflow(err: unknown): HttpError | undefined {
  if (err instanceof NotFound) return new NotFoundError(err.what);
  if (err instanceof InvalidInput) return new ValidationError(err.fields);
  if (err instanceof NotAllowed) return new ForbiddenError(err.message);
  if (err instanceof Conflict) return new ConflictError(err.message, err.current, err.fields);
  return undefined;
}

export const problemHandler: ErrorRequestHandler = (err, req, res, _next) => {
  let e: HttpError;
  const workflow = fromWorkflow(err);
  if (err instanceof HttpError) e = err;
  else if (workflow) e = workflow;
  else if ((err as { type?: string }).type === 'entity.parse.failed') {
    e = new HttpError(
      400,
      'Malformed JSON',
      'The request body is not valid JSON.',
      [{ field: '(body)', message: 'is not valid JSON' }],
      'malformed',
    );
  } else if (err instanceof URIError) {
    // A path with broken percent-encoding (/status/%E0%A4%A) fails to decode before any route runs.
    e = new HttpError(400, 'Malformed URL', 'The address is not valid.', [{ field: '(path)', message: 'is not a valid URL' }], 'malformed');
  } else if ((err as { type?: string }).type === 'entity.too.large') {
    e = new HttpError(413, 'Request too large', 'The request body is too large.', undefined, 'too-large');
  } else if (isDatabaseDown(err)) e = new ServiceUnavailableError();
  else {
    req.log?.error({ err }, 'unhandled error');
    e = new HttpError(500, 'Internal error', 'Something went wrong on our side.', undefined, 'internal');
  }
  if (e.status >= 500 && !(err instanceof HttpError)) req.log?.warn({ code: e.code }, e.detail);
  const body: ProblemDetails & Record<string, unknown> = {
    type: `${PROBLEM_BASE}${e.code}`,
    title: e.title,
    status: e.status,
    ...(e.detail ? { detail: e.detail } : {}),
    // The path without its tokens: a problem body gets pasted into support tickets.
    instance: redactUrl(req.originalUrl),
    ...(e.errors ? { errors: e.errors } : {}),
    ...(e instanceof ConflictError && e.current !== undefined ? { current: e.current } : {}),
  };
  sendProblem(res, body);
};
