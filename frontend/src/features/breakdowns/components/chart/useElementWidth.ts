import { useCallback, useState } from 'react';

/**
 * The current width of an element, followed with a ResizeObserver. Returns a callback ref and the
 * width (`fallback` until the element is measured, or where ResizeObserver does not exist).
 */
export function useElementWidth<T extends HTMLElement>(fallback = 560): [(node: T | null) => void, number] {
  const [width, setWidth] = useState(fallback);
  const ref = useCallback((node: T | null) => {
    if (!node) return undefined;
    const measure = () => {
      const w = Math.floor(node.getBoundingClientRect().width);
      if (w > 0) setWidth(w);
    };
    measure();
    if (typeof ResizeObserver === 'undefined') return undefined;
    const observer = new ResizeObserver(measure);
    observer.observe(node);
    return () => observer.disconnect();
  }, []);
  return [ref, width];
}
