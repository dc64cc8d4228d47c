import { loadConfig } from '../config';
import { closeContext, createContext } from '../context';
import { applyMigrations } from '../db/migrate';

/** Applies the committed migrations in drizzle/ to DATABASE_URL. */
const ctx = createContext(loadConfig());
try {
  await applyMigrations(ctx.db);
} finally {
  await closeContext(ctx);
}
