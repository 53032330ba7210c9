/**
 * Our own illustration for "nothing here" pages: a member whose second
 * support is missing, so its free end droops. Quiet colours, no figures.
 */
export function MissingSupport({ width = 160 }: { width?: number }) {
  return (
    <svg width={width} height={(width * 72) / 160} viewBox="0 0 160 72" aria-hidden="true" focusable="false">
      {/* where the member should be */}
      <path d="M24 22 H136" stroke="#c9d4da" strokeWidth="1.5" strokeDasharray="4 4" />
      {/* the member, drooping past its one support */}
      <path d="M24 22 C 70 22, 110 30, 136 46" fill="none" stroke="#1f6b72" strokeWidth="4" strokeLinecap="round" />
      {/* the support that is there */}
      <path d="M30 25 L20 41 H40 Z" fill="#9cc7c9" />
      <path d="M14 46 H46" stroke="#9cc7c9" strokeWidth="3" strokeLinecap="round" />
      {/* the one that is not */}
      <path d="M130 25 L120 41 H140 Z" fill="none" stroke="#c9d4da" strokeWidth="1.5" strokeDasharray="3 3" />
      <path d="M114 60 H146" stroke="#c9d4da" strokeWidth="3" strokeLinecap="round" strokeDasharray="2 6" />
    </svg>
  );
}
