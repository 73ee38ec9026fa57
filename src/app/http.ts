/** The one fetch wrapper of the client: JSON in and out, errors as ApiError with the server's code and field. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly field?: string,
    readonly body?: Record<string, unknown>,
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

interface ErrorBody {
  error?: { code?: string; message?: string; field?: string; [k: string]: unknown };
  [k: string]: unknown;
}

async function toError(res: Response): Promise<ApiError> {
  let body: ErrorBody | undefined;
  try {
    body = (await res.json()) as ErrorBody;
  } catch {
    body = undefined;
  }
  const e = body?.error;
  const fallback =
    res.status === 401
      ? 'Sign in first.'
      : res.status === 403
        ? 'Your role does not allow this.'
        : res.status >= 500
          ? 'The server could not complete the request. Try again in a moment.'
          : `The request failed (${res.status}).`;
  return new ApiError(res.status, e?.code ?? 'http_' + res.status, e?.message ?? fallback, e?.field, body as Record<string, unknown>);
}

export async function api<T>(path: string, init: RequestInit & { json?: unknown } = {}): Promise<T> {
  const res = await send(path, init);
  if (res.status === 204) return undefined as T;
  const type = res.headers.get('content-type') ?? '';
  return (type.includes('json') ? await res.json() : await res.text()) as T;
}

/** One page of a list the server pages: its rows and how many match in all (`X-Total-Count`). */
export interface Page<T> {
  rows: T[];
  total: number;
}

export async function apiPage<T>(path: string): Promise<Page<T>> {
  const res = await send(path, {});
  const rows = (await res.json()) as T[];
  const total = res.headers.get('X-Total-Count');
  return { rows, total: total === null ? rows.length : Number(total) };
}

async function send(path: string, init: RequestInit & { json?: unknown }): Promise<Response> {
  const { json, headers, ...rest } = init;
  let res: Response;
  try {
    res = await fetch(path, {
      credentials: 'same-origin',
      ...rest,
      headers: { Accept: 'application/json', ...(json !== undefined ? { 'Content-Type': 'application/json' } : {}), ...headers },
      body: json !== undefined ? JSON.stringify(json) : rest.body,
    });
  } catch {
    throw new ApiError(0, 'network', 'The server cannot be reached. Check the connection; your draft is kept in this browser.');
  }
  if (!res.ok) throw await toError(res);
  return res;
}

export function errorMessage(e: unknown): string {
  if (e instanceof Error) return e.message;
  return String(e);
}
