import { matchPath } from 'react-router-dom';
import { paths } from '@/app/paths';

const PATTERNS = Object.values(paths).map((p) => p.path).filter((p) => p !== '/');

/**
 * The in-app path a link in an e-mail points to, or undefined for a link that
 * leaves the app. E-mails carry absolute links to PUBLIC_URL, which may be
 * another origin than this page (the Vite dev server), so a link to one of
 * our screens counts as in-app whatever its host.
 */
export function toAppPath(href: string, origin: string = window.location.origin): string | undefined {
  let url: URL;
  try {
    url = new URL(href, origin);
  } catch {
    return undefined;
  }
  if (url.protocol !== 'http:' && url.protocol !== 'https:') return undefined;
  const sameOrigin = url.origin === origin;
  const isOurScreen = PATTERNS.some((pattern) => matchPath({ path: pattern, end: false }, url.pathname));
  if (!sameOrigin && !isOurScreen) return undefined;
  return url.pathname + url.search + url.hash;
}
