/**
 * Resolves in a later task of the browser's event loop, so work split at an `await nextTask()`
 * runs as several short tasks instead of one long one: between them the browser can paint and
 * answer a tap (a long task is what Lighthouse's Total Blocking Time counts).
 *
 * `scheduler.yield()` where the browser has it; otherwise a message to itself, which, unlike a
 * timer, is not held back to once a second in a tab in the background.
 */
export function nextTask(): Promise<void> {
  const scheduler = (globalThis as { scheduler?: { yield?: () => Promise<void> } }).scheduler;
  if (scheduler?.yield) return scheduler.yield();
  return new Promise((resolve) => {
    const channel = new MessageChannel();
    channel.port1.onmessage = () => {
      channel.port1.close();
      resolve();
    };
    channel.port2.postMessage(undefined);
  });
}
