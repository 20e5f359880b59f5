/** Our mark: a hard-chine frame with a cambered deck beam on its centreline (the same drawing as public/favicon.svg). */
export function LogoMark({ className = 'size-9' }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden="true" focusable="false">
      <rect width="32" height="32" rx="6" fill="#0e5466" />
      <path d="M16 4.5v23.5" stroke="#f2b84b" strokeWidth="1.4" strokeDasharray="2.2 1.6" />
      <path d="M4.8 10.2Q16 7 27.2 10.2L24.6 20.6L16 25.8L7.4 20.6Z" fill="none" stroke="#fff" strokeWidth="2.4" strokeLinejoin="round" />
    </svg>
  );
}
