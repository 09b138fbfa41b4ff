// The mark: a saw kerf through a board, drawn as two offset bars.
export function Logo({ className = '' }: { className?: string }) {
  return (
    <span className={`inline-flex items-center gap-2 font-bold tracking-tight ${className}`}>
      <svg aria-hidden="true" width="22" height="22" viewBox="0 0 22 22">
        <rect x="1" y="4" width="9" height="14" rx="1.5" fill="#e8c98f" stroke="#231f1a" strokeWidth="1.5" />
        <rect x="12" y="4" width="9" height="14" rx="1.5" fill="#e8c98f" stroke="#231f1a" strokeWidth="1.5" />
        <path d="M11 1v20" stroke="#b4380f" strokeWidth="1.5" strokeDasharray="2 2" />
      </svg>
      <span>Kerfline</span>
    </span>
  );
}
