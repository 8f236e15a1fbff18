// What the API writes to its logs, and what it never writes: no query parameters or database values
// (a failed query's parameters have held password hashes, e-mails and phone numbers), no tokens in URLs
// (game tags, status links, invitations, resets, sign-in links), no request headers. One short line per
// request: method, path with tokens redacted, status, time, request id.
import type { IncomingMessage, ServerResponse } from 'node:http';
import pino, { type DestinationStream, type Logger } from 'pino';
import { pinoHttp, type Options } from 'pino-http';
import { UUID } from './params.ts';

export const REDACTED = '[redacted]';

// Our one-time tokens are base64url of 18+ random bytes; a path segment like that is a secret, a UUID is an id.
const TOKEN_LIKE = /^[A-Za-z0-9_-]{16,}$/;

/** The URL with every token-like path segment and every query value replaced. */
export function redactUrl(url: string | undefined): string {
  if (!url) return '';
  const q = url.indexOf('?');
  const pathPart = q === -1 ? url : url.slice(0, q);
  const path = pathPart
    .split('/')
    .map((seg) => (TOKEN_LIKE.test(seg) && !UUID.test(seg) ? REDACTED : seg))
    .join('/');
  if (q === -1) return path;
  // Query values can carry tokens, e-mails or search text: keep the names only.
  const names = url
    .slice(q + 1)
    .split('&')
    .filter(Boolean)
    .map((pair) => `${pair.split('=')[0]}=${REDACTED}`);
  return `${path}?${names.join('&')}`;
}

const SQLSTATE = /^[0-9A-Z]{5}$/;

interface LoggedError {
  type: string;
  message?: string;
  code?: string;
  constraint?: string;
  table?: string;
  column?: string;
  stack?: string;
  cause?: LoggedError;
}

/**
 * Errors without their data: a database error keeps its SQLSTATE, constraint and table, never its message
 * or detail (PostgreSQL puts values in both); a failed query keeps its SQL text (placeholders only), never
 * its parameters.
 */
export function serializeError(err: unknown, depth = 0): LoggedError {
  if (!(err instanceof Error)) return { type: typeof err };
  const e = err as Error & { code?: unknown; constraint?: string; table?: string; column?: string; query?: string };
  const fromDatabase = typeof e.code === 'string' && SQLSTATE.test(e.code);
  const failedQuery = typeof e.query === 'string' && 'params' in e;
  const message = fromDatabase ? undefined : failedQuery ? `Failed query: ${e.query}` : stripParams(e.message);
  const out: LoggedError = { type: e.name };
  if (message) out.message = message;
  if (typeof e.code === 'string') out.code = e.code;
  if (e.constraint) out.constraint = e.constraint;
  if (e.table) out.table = e.table;
  if (e.column) out.column = e.column;
  // The stack's first line repeats the message: keep only the frames.
  if (e.stack)
    out.stack = e.stack
      .split('\n')
      .filter((l) => /^\s+at /.test(l))
      .join('\n');
  if (e.cause !== undefined && depth < 3) out.cause = serializeError(e.cause, depth + 1);
  return out;
}

function stripParams(message: string): string {
  const cut = message.search(/\n?params:/);
  return cut === -1 ? message : message.slice(0, cut);
}

export function createLogger(opts: { level: string; destination?: DestinationStream }): Logger {
  const options = {
    level: opts.level,
    serializers: { err: serializeError, error: serializeError },
    // Belt and braces: these never belong in a log line, wherever a caller put them.
    redact: { paths: ['password', '*.password', 'passwordHash', '*.passwordHash', 'token', '*.token'], censor: REDACTED },
  };
  return opts.destination ? pino(options, opts.destination) : pino(options);
}

type Req = IncomingMessage & { id?: unknown; originalUrl?: string };

/** One short line per request; request id on every line the handler logs (req.log). */
export function requestLogger(logger: Logger) {
  const options: Options<Req, ServerResponse> = {
    logger,
    quietReqLogger: true,
    genReqId: (req, res) => {
      const given = req.headers['x-request-id'];
      const id = typeof given === 'string' && /^[\w.-]{1,100}$/.test(given) ? given : crypto.randomUUID();
      res.setHeader('x-request-id', id);
      return id;
    },
    // Our serializers get the raw objects (wrapped ones would hand serializeError a plain copy of the error).
    wrapSerializers: false,
    serializers: {
      req: (req: Req) => ({ method: req.method, url: redactUrl(req.originalUrl ?? req.url) }),
      res: (res: ServerResponse) => ({ status: res.statusCode }),
      err: serializeError,
    },
    customSuccessMessage: (req, res, ms) => `${req.method} ${redactUrl(req.originalUrl ?? req.url)} ${res.statusCode} ${Math.round(ms)} ms`,
    customErrorMessage: (req, res) => `${req.method} ${redactUrl(req.originalUrl ?? req.url)} ${res.statusCode} failed`,
    customAttributeKeys: { responseTime: 'ms' },
    // The failure itself is logged once, by the error handler, with its stack; the request line stays short.
    customErrorObject: (_req, _res, _err, val: { err?: unknown }) => ({ ...val, err: undefined }),
    autoLogging: { ignore: (req) => req.url === '/api/health' },
  };
  return pinoHttp(options);
}
