// Shown while a board page's data loads: quiet placeholders, announced once.
export default function BoardLoading() {
  return (
    <div role="status" aria-live="polite" className="animate-pulse space-y-4" data-testid="loading">
      <span className="sr-only">Loading…</span>
      <div className="h-6 w-48 rounded bg-paper-200" />
      <div className="h-4 w-80 rounded bg-paper-200" />
      <div className="h-40 rounded-lg border border-paper-200 bg-paper-100" />
    </div>
  );
}
