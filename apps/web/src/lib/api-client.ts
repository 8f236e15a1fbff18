// The one way the web app talks to the API: JSON, same origin, our CSRF header, and
// RFC 9457 problem details turned into an ApiError that forms can show field by field.
import type { ProblemDetails } from '@bumperline/contracts/common';

export class ApiError extends Error {
  constructor(readonly problem: ProblemDetails & { current?: unknown }) {
    super(problem.detail ?? problem.title);
  }
  get status() {
    return this.problem.status;
  }
  fieldErrors(): Record<string, string> {
    return Object.fromEntries((this.problem.errors ?? []).map((e) => [e.field, e.message]));
  }
}

type Query = Record<string, string | number | boolean | undefined | null>;

function withQuery(path: string, query?: Query): string {
  if (!query) return path;
  const params = new URLSearchParams();
  for (const [k, v] of Object.entries(query)) if (v !== undefined && v !== null && v !== '') params.set(k, String(v));
  const s = params.toString();
  return s ? `${path}?${s}` : path;
}

export async function api<T>(
  method: string,
  path: string,
  opts: { body?: unknown; query?: Query; headers?: Record<string, string> } = {},
): Promise<T> {
  let res: Response;
  // A FormData body (a photo) goes as multipart, with the boundary the browser sets.
  const form = opts.body instanceof FormData ? opts.body : null;
  try {
    res = await fetch(withQuery(path, opts.query), {
      method,
      credentials: 'same-origin',
      headers: {
        Accept: 'application/json',
        'X-Requested-With': 'bumperline',
        ...(opts.body !== undefined && !form ? { 'Content-Type': 'application/json' } : {}),
        ...opts.headers,
      },
      body: form ?? (opts.body !== undefined ? JSON.stringify(opts.body) : undefined),
    });
  } catch {
    throw new ApiError({
      type: 'about:blank',
      title: 'No connection',
      status: 0,
      detail: 'Could not reach Bumperline. Check the connection and try again.',
    });
  }
  if (res.status === 204) return undefined as T;
  const body: unknown = await res.json().catch(() => null);
  if (!res.ok) {
    const problem = (body && typeof body === 'object' ? body : {}) as Partial<ProblemDetails>;
    throw new ApiError({
      type: problem.type ?? 'about:blank',
      title: problem.title ?? res.statusText,
      status: res.status,
      ...problem,
    } as ProblemDetails);
  }
  return body as T;
}

export const get = <T>(path: string, query?: Query) => api<T>('GET', path, { query });
export const post = <T>(path: string, body?: unknown) => api<T>('POST', path, { body: body ?? {} });
export const patch = <T>(path: string, body: unknown) => api<T>('PATCH', path, { body });
export const del = <T>(path: string) => api<T>('DELETE', path);
export const put = <T>(path: string, body: unknown) => api<T>('PUT', path, { body });
/** A multipart upload (photos). */
export const postForm = <T>(path: string, form: FormData) => api<T>('POST', path, { body: form });
