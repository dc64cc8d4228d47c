// The API's own context (database, object store) in the bench process, so a part can write the
// few records it needs with the test factories before it measures the API process.
import { loadConfig } from '../../../apps/api/src/config';
import { closeContext, createContext, type AppContext } from '../../../apps/api/src/context';

/** A context on the bench services the orchestrator started (their addresses are in the environment). */
export function openBenchContext(): { ctx: AppContext; close: () => Promise<void> } {
  const ctx = createContext(loadConfig({ ...process.env, JOBS_ENABLED: 'false', LOG_LEVEL: 'warn' }));
  return { ctx, close: () => closeContext(ctx) };
}
