import type { MouseEvent } from 'react';
import { useNavigate } from 'react-router-dom';
import { toAppPath } from './app-link';

// http(s) URLs up to whitespace or a character that cannot end one in prose.
const URL_PATTERN = /https?:\/\/[^\s<>"'`]+/g;
const TRAILING = /[.,;:!?)\]}»”’]+$/;

export type TextPart = { kind: 'text'; text: string } | { kind: 'link'; href: string };

/** Splits plain text into text and links; trailing punctuation stays text. */
export function splitLinks(text: string): TextPart[] {
  const parts: TextPart[] = [];
  let last = 0;
  for (const m of text.matchAll(URL_PATTERN)) {
    const start = m.index ?? 0;
    let href = m[0];
    const trail = TRAILING.exec(href)?.[0] ?? '';
    if (trail) href = href.slice(0, -trail.length);
    if (start > last) parts.push({ kind: 'text', text: text.slice(last, start) });
    parts.push({ kind: 'link', href });
    last = start + href.length;
  }
  if (last < text.length) parts.push({ kind: 'text', text: text.slice(last) });
  return parts;
}

/** An e-mail's text with its links clickable; links to our screens open in the app. */
export function LinkifiedText({ text }: { text: string }) {
  const navigate = useNavigate();
  const open = (e: MouseEvent<HTMLAnchorElement>, href: string) => {
    const inApp = toAppPath(href);
    if (inApp && !e.metaKey && !e.ctrlKey && !e.shiftKey && e.button === 0) {
      e.preventDefault();
      navigate(inApp);
    }
  };
  return (
    <pre style={{ whiteSpace: 'pre-wrap', wordBreak: 'break-word', fontFamily: 'inherit', margin: 0, fontSize: 14 }}>
      {splitLinks(text).map((p, i) =>
        p.kind === 'text' ? (
          p.text
        ) : toAppPath(p.href) ? (
          <a key={i} href={p.href} onClick={(e) => open(e, p.href)}>
            {p.href}
          </a>
        ) : (
          <a key={i} href={p.href} target="_blank" rel="noopener noreferrer">
            {p.href}
          </a>
        ),
      )}
    </pre>
  );
}
