/** Pulseloom's mark: three pulses of uneven spacing woven over a baseline. */
export function Logo({ className = '' }: { className?: string }) {
  return (
    <span className={`inline-flex items-center gap-2 font-semibold tracking-tight ${className}`}>
      <svg width="26" height="18" viewBox="0 0 26 18" aria-hidden="true">
        <path d="M1 14h4V4h2v10h6V7h2v7h3V2h2v12h5" fill="none" stroke="currentColor" strokeWidth="1.8" strokeLinejoin="round" />
      </svg>
      Pulseloom
    </span>
  );
}
