import type { ApiErrorBody, ErrorCode } from '@sagline/common/api-types';

/**
 * A stand-in for the API in component tests: answers fetch() from a table of
 * `METHOD /path` routes and records every request the page made. The real API
 * is exercised by its own integration tests and by the end-to-end journeys.
 */
export interface StubRequest {
  method: string;
  path: string;
  headers: Record<string, string>;
  body: unknown;
}

export interface StubAnswer {
  status?: number;
  body?: unknown;
  headers?: Record<string, string>;
}

export type StubHandler = StubAnswer | ((req: StubRequest, params: Record<string, string>) => StubAnswer);

export type StubRoutes = Record<string, StubHandler>;

/** An answer in the API's error shape (common/src/api-types/errors.ts). */
export function apiError(
  statusCode: number,
  code: ErrorCode,
  message: string,
  extra: Partial<ApiErrorBody> & { headers?: Record<string, string> } = {},
): StubAnswer {
  const { headers, ...rest } = extra;
  const reason: Record<number, string> = {
    400: 'Bad Request',
    401: 'Unauthorized',
    403: 'Forbidden',
    404: 'Not Found',
    409: 'Conflict',
    410: 'Gone',
    429: 'Too Many Requests',
    500: 'Internal Server Error',
  };
  return { status: statusCode, body: { statusCode, error: reason[statusCode] ?? 'Error', code, message, ...rest }, headers };
}

function match(pattern: string, path: string): Record<string, string> | null {
  const p = pattern.split('/');
  const s = path.split('/');
  if (p.length !== s.length) return null;
  const params: Record<string, string> = {};
  for (let i = 0; i < p.length; i++) {
    if (p[i].startsWith(':')) params[p[i].slice(1)] = decodeURIComponent(s[i]);
    else if (p[i] !== s[i]) return null;
  }
  return params;
}

export interface FetchStub {
  /** Every request, in order. */
  requests: StubRequest[];
  /** Requests to one route, e.g. `calls('POST /api/auth/sign-in')`. */
  calls: (route: string) => StubRequest[];
  /** Replace or add routes mid-test. */
  set: (routes: StubRoutes) => void;
}

/** Installs the stub as global fetch. Unknown routes answer 404 NOT_FOUND. */
export function stubFetch(initial: StubRoutes): FetchStub {
  const routes: StubRoutes = { ...initial };
  const requests: StubRequest[] = [];

  const impl = async (input: RequestInfo | URL, init: RequestInit = {}): Promise<Response> => {
    const url = new URL(typeof input === 'string' ? input : input instanceof URL ? input.href : input.url, 'http://localhost');
    const method = (init.method ?? 'GET').toUpperCase();
    const headers: Record<string, string> = {};
    for (const [k, v] of Object.entries((init.headers as Record<string, string>) ?? {})) headers[k.toLowerCase()] = v;
    const body = typeof init.body === 'string' ? JSON.parse(init.body) : undefined;
    const req: StubRequest = { method, path: url.pathname + url.search, headers, body };
    requests.push(req);

    for (const [route, handler] of Object.entries(routes)) {
      const [m, pattern] = route.split(' ');
      if (m !== method) continue;
      const params = match(pattern, url.pathname);
      if (!params) continue;
      const answer = typeof handler === 'function' ? handler(req, params) : handler;
      const status = answer.status ?? 200;
      const text = answer.body === undefined ? null : JSON.stringify(answer.body);
      return new Response(status === 204 ? null : text, {
        status,
        headers: { 'Content-Type': 'application/json', ...answer.headers },
      });
    }
    const miss = apiError(404, 'NOT_FOUND', `No stub for ${method} ${url.pathname}`);
    return new Response(JSON.stringify(miss.body), { status: 404, headers: { 'Content-Type': 'application/json' } });
  };

  globalThis.fetch = jest.fn(impl) as typeof fetch;
  return {
    requests,
    calls: (route) => {
      const [m, pattern] = route.split(' ');
      return requests.filter((r) => r.method === m && match(pattern, r.path.split('?')[0]));
    },
    set: (more) => Object.assign(routes, more),
  };
}
