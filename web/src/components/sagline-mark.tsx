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
      {/* the member, deflected: a shallow curve between its supports */}
      <path d="M5 14 Q16 20 27 14" fill="none" stroke="#ffffff" strokeWidth="2.4" strokeLinecap="round" />
      {/* two supports on their ground lines */}
      <path d="M7 16.2 L3.8 21.4 H10.2 Z M25 16.2 L21.8 21.4 H28.2 Z" fill="#bfe0e1" />
      <path d="M3 23.6 H11 M21 23.6 H29" stroke="#bfe0e1" strokeWidth="1.4" strokeLinecap="round" />
    </svg>
  );
}
