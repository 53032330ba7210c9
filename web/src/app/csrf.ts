import { CSRF_COOKIE } from '@sagline/common/api-types';

/**
 * The API sets a readable `sagline_csrf` cookie on every response (auth.ts);
 * state-changing requests echo it in a header (double-submit cookie).
 */
export function readCsrfToken(cookieString: string = document.cookie): string | undefined {
  for (const part of cookieString.split(';')) {
    const eq = part.indexOf('=');
    if (eq < 0) continue;
    if (part.slice(0, eq).trim() === CSRF_COOKIE) return decodeURIComponent(part.slice(eq + 1).trim());
  }
  return undefined;
}
