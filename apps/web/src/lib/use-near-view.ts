import { useEffect, useRef, useState, useSyncExternalStore } from 'react';

const subscribeNever = () => () => undefined;
const lacksObserver = () => typeof IntersectionObserver === 'undefined';
/** A page drawn on the server has no viewport: nothing is near it, so hydration matches what was drawn. */
const onServer = () => false;

/**
 * Whether an element has come within `margin` of the viewport (and stays so once it has), for
 * work a reader cannot see until they scroll to it: a chart below the fold on a phone. True at
 * once in a browser without IntersectionObserver, and when the page is about to print; false
 * while a page is drawn on the server and hydrated.
 */
export function useNearView<T extends Element>(margin = '200px') {
  const ref = useRef<T>(null);
  const [seen, setSeen] = useState(false);
  const noObserver = useSyncExternalStore(subscribeNever, lacksObserver, onServer);
  const near = seen || noObserver;
  useEffect(() => {
    const element = ref.current;
    if (near || !element) return;
    const observer = new IntersectionObserver(
      (entries) => {
        if (entries.some((entry) => entry.isIntersecting)) setSeen(true);
      },
      { rootMargin: margin },
    );
    observer.observe(element);
    const beforePrint = () => setSeen(true);
    window.addEventListener('beforeprint', beforePrint);
    return () => {
      observer.disconnect();
      window.removeEventListener('beforeprint', beforePrint);
    };
  }, [near, margin]);
  return [ref, near] as const;
}
