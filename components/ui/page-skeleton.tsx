export function PageSkeleton() {
  return (
    <div role="status" aria-live="polite" className="space-y-4">
      <span className="sr-only">Loading…</span>
      <div className="h-8 w-48 animate-pulse rounded bg-paper-deep" />
      <div className="h-32 animate-pulse rounded-card bg-paper-deep" />
    </div>
  );
}
