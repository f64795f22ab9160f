// The mark: branches of a dispersion leaving one point (Γ) and spreading apart.
export function LogoMark({ className = 'h-7 w-7', title }: { className?: string; title?: string }) {
  return (
    <svg
      viewBox="0 0 32 32"
      className={className}
      role={title ? 'img' : undefined}
      aria-hidden={title ? undefined : true}
      aria-label={title}
      focusable="false"
    >
      <rect x="0.5" y="0.5" width="31" height="31" rx="7" className="fill-ink-900 stroke-ink-700" />
      <path d="M6 25 V7" className="stroke-ink-700" strokeWidth="1.25" />
      <path d="M6 25 C 12 14, 18 9.5, 26 8" fill="none" className="stroke-ember-300" strokeWidth="2.4" strokeLinecap="round" />
      <path d="M6 25 C 13 19, 19 16, 26 15.5" fill="none" className="stroke-ink-200" strokeWidth="1.9" strokeLinecap="round" />
      <path d="M6 25 C 13 23.5, 19 22.5, 26 22.5" fill="none" className="stroke-ink-400" strokeWidth="1.6" strokeLinecap="round" />
      <circle cx="6" cy="25" r="2.6" className="fill-paper-50" />
    </svg>
  );
}

export function Wordmark({ className = '' }: { className?: string }) {
  return (
    <span className={`inline-flex items-center gap-2 font-semibold tracking-tight ${className}`}>
      <LogoMark />
      <span>Branchwise</span>
    </span>
  );
}
