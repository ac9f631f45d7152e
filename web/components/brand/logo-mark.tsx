// Bindery's mark: a B made of one spine (the transmitter's link) and two receiver
// boards with their output pins, bound to it; the same drawing as public/favicon.svg.
export function LogoMark({ className }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden="true" focusable="false">
      <rect width="32" height="32" rx="7" fill="#1d4a73" />
      <g transform="translate(0.8 0.5)">
        <rect x="7.2" y="7" width="2.6" height="18" rx="1.3" fill="#f5f0e6" />
        <path d="M11.2 7h5.4a3.9 3.9 0 0 1 0 7.8h-5.4z" fill="#f5f0e6" />
        <path d="M11.2 16.4h6.2a4.3 4.3 0 0 1 0 8.6h-6.2z" fill="#e0d3bb" />
        <g fill="#1d4a73">
          <circle cx="13.5" cy="10.9" r="0.95" />
          <circle cx="16.3" cy="10.9" r="0.95" />
          <circle cx="13.5" cy="20.7" r="0.95" />
          <circle cx="16.3" cy="20.7" r="0.95" />
          <circle cx="19.1" cy="20.7" r="0.95" />
        </g>
      </g>
      <path
        d="M21.6 6.6a3.4 3.4 0 0 1 2.6 2.6M21.9 4a6 6 0 0 1 4.9 4.9"
        fill="none"
        stroke="#e0d3bb"
        strokeWidth="1.7"
        strokeLinecap="round"
      />
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
