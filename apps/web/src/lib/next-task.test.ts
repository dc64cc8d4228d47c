import { afterEach, describe, expect, it, vi } from 'vitest';
import { nextTask } from './next-task';

describe('nextTask', () => {
  afterEach(() => vi.unstubAllGlobals());

  it('resolves in a later task: after every microtask the current task queued', async () => {
    let chain = 0;
    const step = (): Promise<void> | undefined => (++chain < 1000 ? Promise.resolve().then(step) : undefined);
    void Promise.resolve().then(step);
    await nextTask();
    // A promise resolved in this task would have come back after a handful of those 1000 steps.
    expect(chain).toBe(1000);
  });

  it('uses scheduler.yield() where the browser has it', async () => {
    const yieldToBrowser = vi.fn(() => Promise.resolve());
    vi.stubGlobal('scheduler', { yield: yieldToBrowser });
    await nextTask();
    expect(yieldToBrowser).toHaveBeenCalledOnce();
  });
});
