import { useId } from 'react';

export type Measure = 'abs' | 'signed';

export const MEASURE_LABELS: Record<Measure, string> = {
  abs: 'Mean absolute error',
  signed: 'Mean signed error',
};

/** Which error a chart draws: the size of the misses, or their direction. */
export function MeasureToggle({ value, onChange, chart }: { value: Measure; onChange: (m: Measure) => void; chart: string }) {
  const name = useId();
  return (
    <fieldset className="flex flex-wrap items-center gap-x-4 gap-y-1 text-sm">
      <legend className="sr-only">Error drawn in {chart}</legend>
      <span aria-hidden="true" className="font-medium text-ink-700">
        Draw:
      </span>
      {(Object.keys(MEASURE_LABELS) as Measure[]).map((m) => (
        <label key={m} className="inline-flex items-center gap-1.5 text-ink-800">
          <input type="radio" name={name} value={m} checked={value === m} onChange={() => onChange(m)} className="accent-accent-700" />
          {MEASURE_LABELS[m]}
        </label>
      ))}
    </fieldset>
  );
}
