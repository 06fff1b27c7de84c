/** The visible label on anything drawn from the fictional demo scenario. */
export function FictionalLabel() {
  return (
    <p className="inline-flex items-center gap-1.5 rounded-md border border-caution-200 bg-caution-50 px-2.5 py-1 text-sm font-medium text-caution-900">
      <span aria-hidden="true">◇</span>Fictional demo data
    </p>
  );
}
