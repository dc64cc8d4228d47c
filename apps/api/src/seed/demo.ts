import type { AppContext } from '../context';
import { bumpReadRevision } from '../db/read-cache';
import { seedMarker } from '../db/schema/index';
import { seedDemoAccounts } from '../modules/users/demo-accounts';
import { grantDemoViewerSites, seedDemoRegister } from './demo-register';
import { seedDemoWork } from './demo-work';

/**
 * Seeds the invented demo scenario (../shared/demo-scenario.md) once, into a database that has
 * never been seeded. Each area of the product adds its part here, in dependency order.
 */
const seedParts: Array<(ctx: AppContext) => Promise<void>> = [seedDemoAccounts, seedDemoRegister, grantDemoViewerSites, seedDemoWork];

export async function seedDemoIfEmpty(ctx: AppContext): Promise<boolean> {
  const done = await ctx.db.select().from(seedMarker).limit(1);
  if (done.length > 0) return false;
  for (const part of seedParts) await part(ctx);
  await ctx.db.insert(seedMarker).values({ id: 1, seededAt: new Date() });
  // Written outside the API: no answer stored before the seed may be served after it.
  await bumpReadRevision(ctx.db);
  return true;
}
