import { useCallback, useRef, useState, type RefObject } from 'react';

export interface ChartExportOptions {
  /** Shown when the chart has no SVG to save yet; null to do nothing quietly. */
  missingMessage?: string | null;
  /** Shown when a download fails without an error message of its own. */
  fallbackMessage?: string;
}

export interface ChartExport<E extends HTMLElement> {
  /** Put on the element that holds the chart's SVG. */
  ref: RefObject<E | null>;
  /** Why the last download failed; null when it did not. */
  failure: string | null;
  /** Runs a download, keeping its error message (if any) in `failure`. */
  run: (action: () => void | Promise<void>) => Promise<void>;
  /** Runs a download of the chart's SVG element, or says that the chart is not drawn yet. */
  withSvg: (action: (svg: SVGSVGElement) => void | Promise<void>) => Promise<void>;
}

/**
 * The plumbing behind a chart's download buttons: where its SVG is, running a download and
 * keeping the reason a download failed, for the chart to show.
 */
export function useChartExport<E extends HTMLElement = HTMLDivElement>({
  missingMessage = 'The chart is not drawn yet.',
  fallbackMessage = 'The download failed.',
}: ChartExportOptions = {}): ChartExport<E> {
  const ref = useRef<E | null>(null);
  const [failure, setFailure] = useState<string | null>(null);

  const run = useCallback(
    async (action: () => void | Promise<void>) => {
      setFailure(null);
      try {
        await action();
      } catch (error) {
        setFailure(error instanceof Error ? error.message : fallbackMessage);
      }
    },
    [fallbackMessage],
  );

  const withSvg = useCallback(
    (action: (svg: SVGSVGElement) => void | Promise<void>) =>
      run(async () => {
        const svg = ref.current?.querySelector('svg');
        if (svg instanceof SVGSVGElement) await action(svg);
        else if (missingMessage !== null) throw new Error(missingMessage);
      }),
    [run, missingMessage],
  );

  return { ref, failure, run, withSvg };
}
