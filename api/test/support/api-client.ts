import type { Server } from 'node:http';
import request, { type Response, type Test } from 'supertest';
import { CSRF_COOKIE, CSRF_HEADER } from '@sagline/common/api-types';

type Method = 'get' | 'post' | 'patch' | 'put' | 'delete';

/**
 * A browser-like client: keeps cookies across requests (and across api
 * restarts), and echoes the CSRF cookie in the header on unsafe methods, as
 * the web client does. `{ csrf: false }` or `{ csrfToken }` to misbehave.
 */
export class ApiClient {
  private readonly cookies = new Map<string, string>();

  constructor(private server: Server) {}

  /** A client that has made the first GET (and so holds a CSRF cookie), not signed in. */
  static async anonymous(server: Server): Promise<ApiClient> {
    const c = new ApiClient(server);
    await c.get('/api/auth/me');
    return c;
  }

  /** Signed in with e-mail and password; throws if the sign-in was refused. */
  static async signedIn(server: Server, email: string, password: string): Promise<ApiClient> {
    const c = await ApiClient.anonymous(server);
    const res = await c.post('/api/auth/sign-in', { email, password });
    if (res.status !== 200) throw new Error(`sign-in of ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
    return c;
  }

  /** Points the same cookies at another server (the api after a restart). */
  rebind(server: Server): this {
    this.server = server;
    return this;
  }

  cookie(name: string): string | undefined {
    return this.cookies.get(name);
  }

  get csrfToken(): string | undefined {
    return this.cookies.get(CSRF_COOKIE);
  }

  get(url: string): Promise<Response> {
    return this.send('get', url);
  }

  post(url: string, body?: unknown, opts?: SendOptions): Promise<Response> {
    return this.send('post', url, body, opts);
  }

  patch(url: string, body?: unknown, opts?: SendOptions): Promise<Response> {
    return this.send('patch', url, body, opts);
  }

  delete(url: string, opts?: SendOptions): Promise<Response> {
    return this.send('delete', url, undefined, opts);
  }

  /** A request with a body sent as-is (malformed JSON, wrong content type). */
  raw(method: Method, url: string, body: string, contentType = 'application/json', opts?: SendOptions): Promise<Response> {
    return this.send(method, url, body, { ...opts, contentType });
  }

  async send(method: Method, url: string, body?: unknown, opts: SendOptions = {}): Promise<Response> {
    let req: Test = request(this.server)[method](url);
    if (this.cookies.size) req = req.set('Cookie', [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; '));
    if (method !== 'get' && opts.csrf !== false) {
      const token = opts.csrfToken ?? this.csrfToken;
      if (token) req = req.set(CSRF_HEADER, token);
    }
    if (opts.contentType) req = req.set('Content-Type', opts.contentType);
    const res = body === undefined ? await req : await req.send(body as object);
    this.remember(res);
    return res;
  }

  private remember(res: Response): void {
    const raw = res.headers['set-cookie'] as unknown as string[] | string | undefined;
    for (const line of Array.isArray(raw) ? raw : raw ? [raw] : []) {
      const [pair, ...attrs] = line.split(';');
      const eq = pair.indexOf('=');
      const name = pair.slice(0, eq).trim();
      const value = pair.slice(eq + 1).trim();
      const expired = attrs.some((a) => {
        const [k, v] = a.trim().split('=');
        return (k.toLowerCase() === 'max-age' && Number(v) <= 0) || (k.toLowerCase() === 'expires' && Date.parse(v) < Date.now());
      });
      if (expired || value === '') this.cookies.delete(name);
      else this.cookies.set(name, value);
    }
  }
}

export interface SendOptions {
  csrf?: boolean;
  csrfToken?: string;
  contentType?: string;
}
