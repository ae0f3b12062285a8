export function Loading({ label = "Loading…", className = "" }: { label?: string; className?: string }) {
  return (
    <div role="status" className={`flex items-center gap-3 py-8 text-ink-muted ${className}`}>
      <span aria-hidden="true" className="h-5 w-5 animate-spin rounded-full border-2 border-rule-strong border-r-accent" />
      <span>{label}</span>
    </div>
  );
}
