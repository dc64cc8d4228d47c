import { useCallback, useState } from 'react';

/**
 * The rendered width of an element, px, kept up to date as it resizes; `fallback` until the
 * first measurement (and where there is no ResizeObserver). Drawings lay themselves out in real
 * pixels with it, so their text stays at its type size on a phone.
 */
export function useElementWidth<T extends HTMLElement>(fallback = 640): [(element: T | null) => void, number] {
  const [width, setWidth] = useState(fallback);
  const ref = useCallback((element: T | null) => {
    if (!element || typeof ResizeObserver === 'undefined') return;
    const measure = () => {
      const next = Math.round(element.getBoundingClientRect().width);
      if (next > 0) setWidth(next);
    };
    measure();
    const observer = new ResizeObserver(measure);
    observer.observe(element);
    return () => observer.disconnect();
  }, []);
  return [ref, width];
}
