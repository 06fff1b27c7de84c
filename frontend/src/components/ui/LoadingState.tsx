export function LoadingState({ label = 'Loading…' }: { label?: string }) {
  return (
    <p role="status" className="flex items-center gap-2 py-6 text-ink-600">
      <span aria-hidden="true" className="size-4 animate-spin rounded-full border-2 border-ink-300 border-t-accent-700" />
      {label}
    </p>
  );
}
