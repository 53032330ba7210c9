/**
 * Sagline's mark: a line that sags gently between two supports, the shape
 * every member check in the product is about.
 */
export function SaglineMark({ size = 28, title }: { size?: number; title?: string }) {
  return (
    <svg
      width={size}
      height={size}
      viewBox="0 0 32 32"
      role={title ? 'img' : undefined}
      aria-hidden={title ? undefined : true}
      aria-label={title}
      focusable="false"
    >
      <rect x="0" y="0" width="32" height="32" rx="7" fill="#1f6b72" />
      {/* the deflected line, a shallow curve below the chord between supports */}
      <path d="M6 13 Q16 20.5 26 13" fill="none" stroke="#ffffff" strokeWidth="2.4" strokeLinecap="round" />
      {/* the undeflected chord, faint */}
      <path d="M6 13 H26" stroke="#9fd0d2" strokeWidth="1" strokeDasharray="1.6 1.8" />
      {/* two supports: pin on the left, roller on the right */}
      <path d="M6 14.5 L3.2 20 H8.8 Z" fill="#cfe8e9" />
      <path d="M26 14.5 L23.2 19 H28.8 Z" fill="#cfe8e9" />
      <circle cx="24.4" cy="20.6" r="1" fill="#cfe8e9" />
      <circle cx="27.6" cy="20.6" r="1" fill="#cfe8e9" />
      <path d="M2.6 22.8 H9.4 M22.6 22.8 H29.4" stroke="#cfe8e9" strokeWidth="1.2" strokeLinecap="round" />
    </svg>
  );
}
