import '@fontsource/work-sans/400.css';
import '@fontsource/work-sans/500.css';
import '@fontsource/work-sans/600.css';
import './styles/index.css';
import { readFirstViewState } from './app/first-view-state';
import { nextTask } from './lib/next-task';

// The entry is kept small: the app itself (src/app/start.tsx, preloaded by index.html, or listed in
// the first view's state when the server drew the page) is imported from here. When the server drew the page's first view, the app's code waits
// until the browser has shown it: on a phone the framework's evaluation and the hydration would
// otherwise run before the first paint and hold it back.

const container = document.getElementById('root');
if (!container) throw new Error('index.html has no #root element');
const root = container;
const firstView = readFirstViewState(document);

const start = () => {
  // The page's script files all at once (index.html left them out to let the first view paint first).
  for (const href of firstView?.modules ?? []) {
    const link = Object.assign(document.createElement('link'), { rel: 'modulepreload', href, crossOrigin: '' });
    document.head.append(link);
  }
  // The framework's chunk and React DOM are evaluated first, the app's modules in a later task, and
  // startApp takes its steps one task at a time (lib/next-task): all of it in one task held a
  // phone's main thread for a quarter of a second (the TBT on the order page).
  void import('react-dom/client')
    .then(nextTask)
    .then(() => import('./app/start'))
    .then(async ({ startApp }) => {
      await nextTask();
      await startApp(root, firstView);
    });
};

/**
 * Runs `run` once the browser reports the page's first contentful paint (the server's first view
 * is on screen), or at once when it already has. A browser that reports no paint timing, or a
 * page that never paints (a tab hidden meanwhile), starts after a second all the same.
 */
function afterFirstPaint(run: () => void) {
  const painted = (entries: PerformanceEntryList) => entries.some((entry) => entry.name === 'first-contentful-paint');
  if (typeof PerformanceObserver === 'undefined' || painted(performance.getEntriesByType('paint'))) return run();
  let started = false;
  const go = () => {
    if (started) return;
    started = true;
    observer.disconnect();
    clearTimeout(fallback);
    run();
  };
  const observer = new PerformanceObserver((list) => painted(list.getEntries()) && go());
  observer.observe({ type: 'paint', buffered: true });
  const fallback = setTimeout(go, 1000);
}

// A hidden tab paints nothing: start at once there.
if (firstView && document.visibilityState === 'visible') afterFirstPaint(start);
else start();
