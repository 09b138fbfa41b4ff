export default function ShotsLoading() {
  return (
    <div role="status" aria-live="polite" className="space-y-5">
      <span className="sr-only">Loading shots…</span>
      <div className="h-8 w-40 animate-pulse rounded bg-paper-deep" />
      <div className="flex gap-2">
        <div className="h-11 w-28 animate-pulse rounded-md bg-paper-deep" />
        <div className="h-11 w-28 animate-pulse rounded-md bg-paper-deep/60" />
      </div>
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        {[0, 1, 2, 3].map((i) => (
          <div key={i} className="h-16 animate-pulse rounded-md bg-paper-deep/70" />
        ))}
      </div>
      <div className="hidden gap-4 md:grid md:grid-cols-3">
        {[0, 1, 2].map((i) => (
          <div key={i} className="h-72 animate-pulse rounded-card bg-paper-deep" />
        ))}
      </div>
      <div className="space-y-3 md:hidden">
        {[0, 1, 2].map((i) => (
          <div key={i} className="h-36 animate-pulse rounded-card bg-paper-deep" />
        ))}
      </div>
    </div>
  );
}
