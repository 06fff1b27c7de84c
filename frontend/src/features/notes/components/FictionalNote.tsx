/** The visible label every screen shows on demo data. */
export function FictionalNote() {
  return (
    <p className="inline-block rounded border border-caution-200 bg-caution-50 px-2 py-1 text-sm font-semibold text-caution-900">
      Fictional demo data
    </p>
  );
}
