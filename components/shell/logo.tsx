/** A stamp face seen from above: a square frame with a four-fold motif, in indigo and soga. */
export function Logo({ className }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden="true">
      <rect x="2" y="2" width="28" height="28" rx="4" fill="#253363" />
      <rect x="6" y="6" width="20" height="20" rx="2" fill="none" stroke="#f3e4d3" strokeWidth="1.5" />
      <path d="M16 8 L19 16 L16 24 L13 16 Z M8 16 L16 13 L24 16 L16 19 Z" fill="#a0632d" />
      <circle cx="16" cy="16" r="2" fill="#f3e4d3" />
    </svg>
  );
}
