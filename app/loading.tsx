/**
 * Root loading state: a thin indeterminate bar at the top and a quiet label, shown while
 * a route's server work is in flight. Route groups with their own chrome should add a
 * loading.tsx with skeletons shaped like their content.
 */
export default function Loading() {
  return (
    <div role="status" aria-live="polite" className="min-h-[50vh]">
      <div className="fixed inset-x-0 top-0 z-[70] h-0.5 overflow-hidden bg-accent-soft">
        <div className="h-full w-2/5 animate-indeterminate bg-accent" />
      </div>
      <p className="sr-only">Loading…</p>
    </div>
  );
}
