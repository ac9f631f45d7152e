// Bindery's mark: one transmitter (the dot) with a spine bound to two receivers (the
// boards), and the dashed link between them; drawn the same as public/favicon.svg.
export function LogoMark({ className, title }: { className?: string; title?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} role={title ? 'img' : undefined} aria-hidden={title ? undefined : true} aria-label={title}>
      <rect width="32" height="32" rx="7" fill="#1d4a73" />
      <circle cx="9" cy="8.5" r="2.6" fill="#f5f0e6" />
      <path d="M9 10.5V23.2M9 15.7h4.5M9 23.2h4.5" stroke="#f5f0e6" strokeWidth="2" strokeLinecap="round" fill="none" />
      <rect x="14" y="13.6" width="11" height="4.2" rx="1.3" fill="#f5f0e6" />
      <rect x="14" y="21.1" width="11" height="4.2" rx="1.3" fill="#e0d3bb" />
      <path d="M13 8.5h11" stroke="#e0d3bb" strokeWidth="2" strokeLinecap="round" strokeDasharray="2 2.4" />
    </svg>
  );
}

export function Wordmark() {
  return (
    <span className="inline-flex items-center gap-2">
      <LogoMark className="h-8 w-8" />
      <span className="text-xl font-semibold tracking-tight text-ink-900">Bindery</span>
    </span>
  );
}
