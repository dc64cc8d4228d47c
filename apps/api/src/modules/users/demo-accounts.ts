import type { Role } from '@varden/schemas';
import type { AppContext } from '../../context';
import { hashPassword } from '../../security/password-hashing';
import { findUserRowByEmail, insertUser, replaceRoles } from './repository';

interface DemoAccount {
  email: string;
  name: string;
  roles: Role[];
}

/**
 * The staff of Korvel Field Services (an invented contractor, see demo-scenario.md) and one
 * facility manager per client site. Every name is invented. The first account of each role has
 * the short e-mail that README shows.
 */
export const demoAccounts: readonly DemoAccount[] = [
  { email: 'admin@demo.varden.test', name: 'Odile Brannock', roles: ['admin'] },
  { email: 'planner@demo.varden.test', name: 'Teodor Vasquell', roles: ['planner'] },
  { email: 'ysolde.farrant@demo.varden.test', name: 'Ysolde Farrant', roles: ['planner'] },
  { email: 'technician@demo.varden.test', name: 'Kasimir Ondrey', roles: ['technician'] },
  { email: 'bex.ardalan@demo.varden.test', name: 'Bex Ardalan', roles: ['technician'] },
  { email: 'nils.okoro-reyes@demo.varden.test', name: 'Nils Okoro-Reyes', roles: ['technician'] },
  { email: 'priya.lindqvale@demo.varden.test', name: 'Priya Lindqvale', roles: ['technician'] },
  { email: 'supervisor@demo.varden.test', name: 'Henrike Castaldo', roles: ['supervisor'] },
  { email: 'amadou.whitloe@demo.varden.test', name: 'Amadou Whitloe', roles: ['supervisor'] },
  { email: 'viewer@demo.varden.test', name: 'Roisin Pellandry', roles: ['viewer'] },
  { email: 'gideon.marrastan@demo.varden.test', name: 'Gideon Marrastan', roles: ['viewer'] },
  { email: 'leontine.abaray@demo.varden.test', name: 'Leontine Abaray', roles: ['viewer'] },
];

/**
 * Which demo site each viewer manages. Sites belong to the register, whose seed part runs after
 * this one and grants them (viewer_site_grants) by these names.
 */
export const demoViewerSites: Readonly<Record<string, string>> = {
  'viewer@demo.varden.test': 'Alder Quay Cold Store',
  'gideon.marrastan@demo.varden.test': 'Brinmoor Pumping Station',
  'leontine.abaray@demo.varden.test': 'Castellan Polymers, Plant 2',
};

/**
 * Seed part: the demo accounts, active, with the password from DEMO_PASSWORD. An account that
 * already exists is left alone, so a seed interrupted half-way can simply run again.
 */
export async function seedDemoAccounts(ctx: AppContext): Promise<void> {
  const now = new Date();
  for (const { email, name, roles } of demoAccounts) {
    if (await findUserRowByEmail(ctx.db, email)) continue;
    const passwordHash = await hashPassword(ctx.config.DEMO_PASSWORD);
    await ctx.db.transaction(async (tx) => {
      const id = await insertUser(tx, { email, name, passwordHash, active: true, passwordChangedAt: now });
      await replaceRoles(tx, id, roles);
    });
  }
}
