/** Getterline's own mark: a bulb outline with a glowing getter arc. */
export function Mark({ className = "h-7 w-7" }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden="true">
      <rect x="8" y="3" width="16" height="22" rx="8" fill="none" stroke="currentColor" strokeWidth="2" />
      <path d="M11 9 a5 5 0 0 1 10 0" fill="none" stroke="#e8701a" strokeWidth="2.5" strokeLinecap="round" />
      <line x1="12" y1="25" x2="12" y2="29" stroke="currentColor" strokeWidth="2" />
      <line x1="16" y1="25" x2="16" y2="29" stroke="currentColor" strokeWidth="2" />
      <line x1="20" y1="25" x2="20" y2="29" stroke="currentColor" strokeWidth="2" />
    </svg>
  );
}
