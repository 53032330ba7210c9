import { useCallback, useRef } from 'react';
import { useNavigate } from 'react-router-dom';
import { toAppPath } from './app-link';

/**
 * An e-mail's HTML in a sandboxed frame: no scripts run in it
 * (`allow-same-origin` without `allow-scripts` only lets this page read the
 * frame). Clicks on links are caught here: ours open in the app, others in a
 * new tab.
 */
export function HtmlMessage({ html, title }: { html: string; title: string }) {
  const navigate = useNavigate();
  const frame = useRef<HTMLIFrameElement>(null);

  const onLoad = useCallback(() => {
    const doc = frame.current?.contentDocument;
    if (!doc) return;
    if (frame.current) frame.current.style.height = `${Math.max(160, doc.documentElement.scrollHeight + 8)}px`;
    doc.addEventListener('click', (e) => {
      const a = (e.target as Element | null)?.closest?.('a[href]');
      if (!a) return;
      e.preventDefault();
      const href = a.getAttribute('href') ?? '';
      const inApp = toAppPath(href);
      if (inApp) navigate(inApp);
      else window.open(href, '_blank', 'noopener,noreferrer');
    });
  }, [navigate]);

  return (
    <iframe
      ref={frame}
      title={title}
      sandbox="allow-same-origin"
      srcDoc={html}
      onLoad={onLoad}
      style={{ width: '100%', minHeight: 160, border: '1px solid #e6ebee', borderRadius: 4, background: '#fff' }}
    />
  );
}
