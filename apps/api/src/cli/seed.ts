import { loadConfig } from '../config';
import { closeContext, createContext } from '../context';
import { applyMigrations } from '../db/migrate';
import { seedDemoIfEmpty } from '../seed/demo';

/** Applies migrations, then seeds the demo scenario when the database holds no data yet. */
const ctx = createContext(loadConfig());
try {
  await applyMigrations(ctx.db);
  const seeded = await seedDemoIfEmpty(ctx);
  console.log(seeded ? 'varden: demo scenario seeded.' : 'varden: database already holds data; demo not re-seeded.');
} finally {
  await closeContext(ctx);
}
