import { useEffect, useRef, useState } from 'react';

/**
 * Whether an element has come within `margin` of the viewport (and stays so once it has), for
 * work a reader cannot see until they scroll to it: a chart below the fold on a phone. True at
 * once without IntersectionObserver, and when the page is about to print.
 */
export function useNearView<T extends Element>(margin = '200px') {
  const ref = useRef<T>(null);
  const [near, setNear] = useState(() => typeof IntersectionObserver === 'undefined');
  useEffect(() => {
    const element = ref.current;
    if (near || !element) return;
    const observer = new IntersectionObserver(
      (entries) => {
        if (entries.some((entry) => entry.isIntersecting)) setNear(true);
      },
      { rootMargin: margin },
    );
    observer.observe(element);
    const beforePrint = () => setNear(true);
    window.addEventListener('beforeprint', beforePrint);
    return () => {
      observer.disconnect();
      window.removeEventListener('beforeprint', beforePrint);
    };
  }, [near, margin]);
  return [ref, near] as const;
}
