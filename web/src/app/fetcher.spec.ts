import { ApiError } from './api-error';
import { apiFetch, setUnauthenticatedHandler } from './fetcher';
import { apiError, stubFetch } from '@/testing/fetch-stub';
import { setCsrfCookie } from '@/testing/render';

describe('apiFetch', () => {
  const onUnauthenticated = jest.fn();
  beforeEach(() => {
    onUnauthenticated.mockReset();
    setUnauthenticatedHandler(onUnauthenticated);
    setCsrfCookie('tok%2Fen-42');
  });

  it('echoes the sagline_csrf cookie as X-CSRF-Token on state-changing requests, not on reads', async () => {
    const api = stubFetch({
      'GET /api/projects': { body: [] },
      'POST /api/projects': { status: 201, body: { id: 1 } },
      'PATCH /api/projects/1/team/2': { body: {} },
      'DELETE /api/projects/1/team/2': { status: 204 },
    });
    await apiFetch('/api/projects');
    await apiFetch('/api/projects', { method: 'POST', body: { name: 'Halvercote Yard' } });
    await apiFetch('/api/projects/1/team/2', { method: 'PATCH', body: { role: 'checker' } });
    await expect(apiFetch('/api/projects/1/team/2', { method: 'DELETE' })).resolves.toBeUndefined();

    const [get, post, patch, del] = api.requests;
    expect(get.headers['x-csrf-token']).toBeUndefined();
    expect(post.headers['x-csrf-token']).toBe('tok/en-42');
    expect(post.headers['content-type']).toBe('application/json');
    expect(post.body).toEqual({ name: 'Halvercote Yard' });
    expect(patch.headers['x-csrf-token']).toBe('tok/en-42');
    expect(del.headers['x-csrf-token']).toBe('tok/en-42');
    expect(globalThis.fetch).toHaveBeenCalledWith('/api/projects', expect.objectContaining({ credentials: 'same-origin' }));
  });

  it('turns the error shape into an ApiError with code, message, details and Retry-After', async () => {
    stubFetch({
      'POST /api/projects': apiError(400, 'VALIDATION_FAILED', 'The project needs a name.', {
        details: [{ path: 'body.name', message: 'name must not be empty' }],
      }),
      'POST /api/auth/sign-in': apiError(429, 'RATE_LIMITED', 'Too many attempts.', { headers: { 'Retry-After': '600' } }),
    });
    const e = await apiFetch('/api/projects', { method: 'POST', body: {} }).catch((x: unknown) => x);
    expect(e).toBeInstanceOf(ApiError);
    expect(e).toMatchObject({
      statusCode: 400,
      error: 'Bad Request',
      code: 'VALIDATION_FAILED',
      message: 'The project needs a name.',
      details: [{ path: 'body.name', message: 'name must not be empty' }],
    });
    const limited = await apiFetch('/api/auth/sign-in', { method: 'POST', body: {}, redirectOn401: false }).catch((x: unknown) => x);
    expect(limited).toMatchObject({ statusCode: 429, code: 'RATE_LIMITED', retryAfterSeconds: 600 });
  });

  it('explains an answer that is not the error shape (a proxy page) and a network failure', async () => {
    globalThis.fetch = jest.fn(async () => new Response('<html>Bad gateway</html>', { status: 502, statusText: 'Bad Gateway' })) as typeof fetch;
    await expect(apiFetch('/api/projects')).rejects.toMatchObject({
      statusCode: 502,
      code: 'BAD_RESPONSE',
      message: expect.stringContaining('HTTP 502 Bad Gateway'),
    });
    globalThis.fetch = jest.fn(async () => {
      throw new TypeError('Failed to fetch');
    }) as typeof fetch;
    await expect(apiFetch('/api/projects')).rejects.toMatchObject({ statusCode: 0, code: 'NETWORK' });
  });

  it('sends the person to sign in on 401, except for a wrong password or when the caller opts out', async () => {
    stubFetch({
      'GET /api/projects': apiError(401, 'UNAUTHENTICATED', 'Your session has ended; sign in again.'),
      'GET /api/auth/me': apiError(401, 'UNAUTHENTICATED', 'Not signed in.'),
      'POST /api/auth/sign-in': apiError(401, 'BAD_CREDENTIALS', 'Wrong e-mail or password.'),
    });
    await expect(apiFetch('/api/projects')).rejects.toMatchObject({ statusCode: 401 });
    expect(onUnauthenticated).toHaveBeenCalledTimes(1);

    await expect(apiFetch('/api/auth/me', { redirectOn401: false })).rejects.toMatchObject({ statusCode: 401 });
    await expect(apiFetch('/api/auth/sign-in', { method: 'POST', body: {} })).rejects.toMatchObject({ code: 'BAD_CREDENTIALS' });
    expect(onUnauthenticated).toHaveBeenCalledTimes(1);
  });
});
