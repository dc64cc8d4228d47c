import { ratedCapacitanceUF, ratedLegUF, reactorInductanceMH, type Connection } from '@varden/engineering';
import { workOrderStates, type Role, type User, type WorkOrderKind, type WorkOrderState } from '@varden/schemas';
import type { AppContext } from '../../apps/api/src/context';
import { startSession } from '../../apps/api/src/access/sessions';
import { sessionCookieName } from '../../apps/api/src/access/session-cookie';
import { hashPassword } from '../../apps/api/src/security/password-hashing';
import { findUserRecord, insertUser, replaceRoles, replaceSiteGrants } from '../../apps/api/src/modules/users/repository';
import { toUser } from '../../apps/api/src/modules/users/to-user';
import { eq } from 'drizzle-orm';
import { bumpReadRevision } from '../../apps/api/src/db/read-cache';
import { banks, capacitorUnits, contactors, fuseSets, outbox, reactors, readings, sites, steps, workOrders } from '../../apps/api/src/db/schema/index';
import { deliverOutbox } from '../../apps/api/src/mail/outbox';
import { applyMigrations } from '../../apps/api/src/db/migrate';
import mysql from 'mysql2/promise';
import { startTestApp, unique, type TestApp } from './test-app';

/** A passphrase the policy accepts; its Argon2id hash is computed once per test file. */
export const defaultPassword = 'copper busbar under the mezzanine';

const hashes = new Map<string, Promise<string>>();
const hashOnce = (password: string) => {
  let hash = hashes.get(password);
  if (!hash) {
    hash = hashPassword(password);
    hashes.set(password, hash);
  }
  return hash;
};

export interface CreatedUser {
  user: User;
  email: string;
  password: string;
}

/**
 * A person with a unique e-mail, written straight to the database (no invitation): active with
 * a password unless told otherwise, so it can sign in at once.
 */
export async function createUser(
  ctx: AppContext,
  options: { roles: Role[]; password?: string; siteIds?: number[]; name?: string; email?: string; active?: boolean },
): Promise<CreatedUser> {
  const password = options.password ?? defaultPassword;
  const email = (options.email ?? `${unique(options.roles.join('-') || 'nobody')}@example.test`).toLowerCase();
  const passwordHash = await hashOnce(password);
  const id = await ctx.db.transaction(async (tx) => {
    const userId = await insertUser(tx, {
      email,
      name: options.name ?? `Test ${options.roles.join(' and ') || 'person'}`,
      passwordHash,
      active: options.active ?? true,
      deactivatedAt: options.active === false ? new Date() : null,
      passwordChangedAt: new Date(),
    });
    await replaceRoles(tx, userId, options.roles);
    await replaceSiteGrants(tx, userId, options.siteIds ?? []);
    return userId;
  });
  const record = await findUserRecord(ctx.db, id);
  return { user: toUser(record!), email, password };
}

/** The session cookie from the Set-Cookie header of a response, as a Cookie header value. */
export function sessionCookieFrom(res: Response): string | undefined {
  for (const header of res.headers.getSetCookie()) {
    const [pair] = header.split(';');
    if (pair?.startsWith(`${sessionCookieName}=`) && pair.length > sessionCookieName.length + 1) return pair;
  }
  return undefined;
}

/** Signs in through the API and returns the Cookie header value for later requests. */
export async function signIn(app: TestApp, email: string, password: string): Promise<string> {
  const res = await app.request('/api/auth/sign-in', { json: { email, password } });
  const cookie = sessionCookieFrom(res);
  if (res.status !== 200 || !cookie) throw new Error(`sign-in of ${email} failed: ${res.status} ${await res.text()}`);
  return cookie;
}

/** A session opened directly, without a password check: for tests that need many sessions fast. */
export async function sessionCookieFor(ctx: AppContext, userId: number): Promise<string> {
  const { token } = await startSession(ctx.db, ctx.config, userId, { ip: '127.0.0.1', userAgent: 'varden-tests' });
  return `${sessionCookieName}=${token}`;
}

/** A site with a unique name and plausible 400 V 50 Hz supply, written straight to the database. */
export async function createSite(ctx: AppContext, values: Partial<typeof sites.$inferInsert> = {}): Promise<number> {
  const [created] = await ctx.db
    .insert(sites)
    .values({
      name: unique('Site'),
      voltageV: 400,
      frequencyHz: 50,
      transformerKva: 1000,
      transformerImpedancePct: 6,
      targetPf: 0.95,
      tariffBasis: 'pf-threshold',
      tariffLimit: 0.9,
      ...values,
    })
    .$returningId();
  await bumpReadRevision(ctx.db);
  return created!.id;
}

export interface CreatedBank {
  siteId: number;
  bankId: number;
  stepIds: number[];
  unitIds: number[];
  contactorIds: number[];
  fuseSetIds: number[];
}

/**
 * A site with one bank of `steps` steps (default 2), each with one 50 kvar 400 V 50 Hz delta
 * unit (capacitance from the nameplate), a contactor and a fuse set, written straight to the
 * database. `dischargeTimesS` sets the units' discharge times in step order.
 */
export async function createBankWithUnits(
  ctx: AppContext,
  options: { steps?: number; dischargeTimesS?: number[]; siteValues?: Partial<typeof sites.$inferInsert> } = {},
): Promise<CreatedBank> {
  const siteId = await createSite(ctx, options.siteValues);
  const [bank] = await ctx.db.insert(banks).values({ siteId, name: unique('Bank'), location: 'Test switchroom' }).$returningId();
  const result: CreatedBank = { siteId, bankId: bank!.id, stepIds: [], unitIds: [], contactorIds: [], fuseSetIds: [] };
  for (let n = 1; n <= (options.steps ?? 2); n++) {
    const step = await insertStep(ctx, result.bankId, n, { unit: { dischargeTimeS: options.dischargeTimesS?.[n - 1] ?? 180, serial: unique('SN') } });
    result.stepIds.push(step.stepId);
    result.unitIds.push(...step.unitIds);
    result.contactorIds.push(step.contactorId);
    result.fuseSetIds.push(step.fuseSetId);
  }
  await bumpReadRevision(ctx.db);
  return result;
}

/**
 * A work order written straight to the database in any state, with the fields that state
 * implies (a sealed one is signed and locked). For tests that start from a given state.
 */
export async function createWorkOrder(
  ctx: AppContext,
  options: {
    bank: { siteId: number; bankId: number };
    state?: WorkOrderState;
    assigneeId?: number | null;
    createdById?: number | null;
    dueOn?: string;
    kind?: WorkOrderKind;
    title?: string;
    flagId?: number | null;
    planId?: number | null;
  },
): Promise<number> {
  const state = options.state ?? 'queued';
  const now = new Date();
  const reached = (s: WorkOrderState) => workOrderStates.indexOf(state) >= workOrderStates.indexOf(s) && state !== 'withdrawn';
  const [created] = await ctx.db
    .insert(workOrders)
    .values({
      kind: options.kind ?? 'inspection',
      siteId: options.bank.siteId,
      bankId: options.bank.bankId,
      planId: options.planId ?? null,
      flagId: options.flagId ?? null,
      title: options.title ?? unique('Order'),
      instructions: 'Test order',
      checklist: ['capacitance'],
      dueOn: options.dueOn ?? now.toISOString().slice(0, 10),
      assigneeId: options.assigneeId ?? null,
      createdById: options.createdById ?? null,
      state,
      safetyAcknowledgedAt: reached('on-site') ? now : null,
      safetyAcknowledgedById: reached('on-site') ? (options.assigneeId ?? null) : null,
      submittedAt: reached('awaiting-review') ? now : null,
      ...(state === 'sealed'
        ? { signedAt: now, signedByName: 'Test signer', signatureMeaning: 'Test signature', locked: true }
        : {}),
    })
    .$returningId();
  await bumpReadRevision(ctx.db);
  return created!.id;
}

/** One step of a bank as the readings and photos tests need it: its units and components. */
export interface StepFixture {
  siteId: number;
  bankId: number;
  stepId: number;
  unitIds: number[];
  contactorId: number;
  reactorId: number | null;
  fuseSetId: number;
  /** The reactor's inductance per line (detuned banks), mH. */
  reactorInductanceMH: number | null;
}

/**
 * A site with one bank of one step (detuned when `detuningFactor` is given): `units` capacitor units (50 kvar 400 V 50 Hz delta unless
 * told otherwise, capacitance from the nameplate), a contactor rated for 100 000 operations,
 * a 100 A gG fuse set and, for a detuned bank, a reactor sized for the detuning factor
 * (L = p/(ω²·C_star), engineering-reference §4).
 */
export async function createStepWithUnits(
  ctx: AppContext,
  options: {
    units?: number;
    nameplate?: { kvar?: number; voltageV?: number; frequencyHz?: number; connection?: Connection };
    unit?: Partial<typeof capacitorUnits.$inferInsert>;
    detuningFactor?: number;
    withReactor?: boolean;
    site?: Partial<typeof sites.$inferInsert>;
    contactor?: Partial<typeof contactors.$inferInsert>;
  } = {},
): Promise<StepFixture> {
  const siteId = await createSite(ctx, options.site);
  const detuned = options.detuningFactor !== undefined;
  const [bank] = await ctx.db
    .insert(banks)
    .values({ siteId, name: unique('Bank'), detuned, detuningFactor: options.detuningFactor ?? null })
    .$returningId();
  const step = await insertStep(ctx, bank!.id, 1, { ...options, frequencyHz: options.site?.frequencyHz ?? 50, detuningFactor: detuned && options.withReactor !== false ? options.detuningFactor : undefined });
  await bumpReadRevision(ctx.db);
  return { siteId, bankId: bank!.id, ...step };
}

type StepOptions = {
  units?: number;
  nameplate?: { kvar?: number; voltageV?: number; frequencyHz?: number; connection?: Connection };
  unit?: Partial<typeof capacitorUnits.$inferInsert>;
  contactor?: Partial<typeof contactors.$inferInsert>;
  /** With a reactor sized for this detuning factor at `frequencyHz`. */
  detuningFactor?: number;
  frequencyHz?: number;
};

/** One step of bank `bankId`: its capacitor units, a contactor, a fuse set and, when detuned, a reactor. */
async function insertStep(ctx: AppContext, bankId: number, number: number, options: StepOptions): Promise<Omit<StepFixture, 'siteId' | 'bankId'>> {
  const [step] = await ctx.db.insert(steps).values({ bankId, number, ratedKvar: 50 * (options.units ?? 1) }).$returningId();
  const nameplate = {
    kvar: options.nameplate?.kvar ?? 50,
    voltageV: options.nameplate?.voltageV ?? 400,
    frequencyHz: options.nameplate?.frequencyHz ?? 50,
    connection: options.nameplate?.connection ?? ('delta' as Connection),
  };
  const unitIds: number[] = [];
  for (let position = 1; position <= (options.units ?? 1); position++) {
    const [unit] = await ctx.db
      .insert(capacitorUnits)
      .values({
        stepId: step!.id,
        position,
        nameplateKvar: nameplate.kvar,
        nameplateVoltageV: nameplate.voltageV,
        nameplateFrequencyHz: nameplate.frequencyHz,
        connection: nameplate.connection,
        capacitanceUF: ratedCapacitanceUF(nameplate),
        ...options.unit,
      })
      .$returningId();
    unitIds.push(unit!.id);
  }
  const [contactor] = await ctx.db.insert(contactors).values({ stepId: step!.id, ratedOperations: 100_000, ...options.contactor }).$returningId();
  const [fuseSet] = await ctx.db.insert(fuseSets).values({ stepId: step!.id, ratedCurrentA: 100 }).$returningId();
  let reactorId: number | null = null;
  let inductanceMH: number | null = null;
  if (options.detuningFactor !== undefined) {
    const leg = ratedLegUF(nameplate) * unitIds.length;
    inductanceMH = reactorInductanceMH({ detuningFactor: options.detuningFactor, legsUF: [leg, leg, leg], frequencyHz: options.frequencyHz ?? 50 });
    const [reactor] = await ctx.db
      .insert(reactors)
      .values({ stepId: step!.id, inductanceMH, ratedCurrentA: 80, detuningFactor: options.detuningFactor })
      .$returningId();
    reactorId = reactor!.id;
  }
  return { stepId: step!.id, unitIds, contactorId: contactor!.id, reactorId, fuseSetId: fuseSet!.id, reactorInductanceMH: inductanceMH };
}

/**
 * A capacitor reading written straight to the readings table (no evaluation run): for work-order
 * tests that need an order to hold a reading with a given result.
 */
export async function insertUnitReading(
  ctx: AppContext,
  options: {
    workOrderId: number;
    unitId: number;
    recordedById: number;
    deviationPct: number;
    band: 'healthy' | 'watch' | 'replace' | 'remeasure';
    recordedAt?: Date;
  },
): Promise<number> {
  const legUF = ratedCapacitanceUF({ kvar: 50, voltageV: 400, frequencyHz: 50, connection: 'delta' }) * (1 + options.deviationPct / 100);
  const [created] = await ctx.db
    .insert(readings)
    .values({
      workOrderId: options.workOrderId,
      idempotencyKey: unique('reading'),
      target: 'capacitor-unit',
      targetId: options.unitId,
      input: { target: 'capacitor-unit', targetId: options.unitId, method: 'per-element', elementsUF: [legUF, legUF, legUF] },
      evaluation: { legsUF: [legUF, legUF, legUF], kvarAtRated: 50 * (1 + options.deviationPct / 100), deviationPct: options.deviationPct, band: options.band },
      engineeringVersion: '1.0.0',
      band: options.band,
      deviationPct: options.deviationPct,
      recordedById: options.recordedById,
      recordedAt: options.recordedAt ?? new Date(),
    })
    .$returningId();
  await bumpReadRevision(ctx.db);
  return created!.id;
}

/**
 * Sends the outbox rows to the address of row `outboxId` (as the job would) until that row has
 * gone to the mail fake; then latestMailTo finds it at its first look.
 */
export async function sendOutboxThrough(ctx: AppContext, outboxId: number, timeoutMs = 100_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const [row] = await ctx.db.select({ status: outbox.status, toAddress: outbox.toAddress }).from(outbox).where(eq(outbox.id, outboxId));
    if (!row || row.status === 'sent') return;
    if (row.status === 'failed') throw new Error(`outbox row ${outboxId} failed to send`);
    // Only this row's address: other files' mail in the shared outbox never holds it up.
    if ((await deliverOutbox(ctx.db, ctx.mail, ctx.log, { batch: 50, toAddress: row.toAddress })) === 0) await new Promise((resolve) => setTimeout(resolve, 100));
  }
  throw new Error(`outbox row ${outboxId} was not sent within ${timeoutMs} ms`);
}

/**
 * The real API on a database of its own (created, migrated, and dropped by `close`), for tests
 * that need what the shared database cannot give: an empty database to seed the demo into, or
 * an outbox holding only their own mail so that delivering it takes no time behind other files'.
 */
export async function startIsolatedTestApp(name: string): Promise<TestApp> {
  const url = new URL(process.env.DATABASE_URL!);
  const database = `varden_${name}_${process.pid}_${Math.random().toString(36).slice(2, 8)}`;
  const root = await mysql.createConnection({ host: url.hostname, port: Number(url.port), user: url.username, password: decodeURIComponent(url.password) });
  await root.query(`CREATE DATABASE \`${database}\``);
  url.pathname = `/${database}`;
  const app = await startTestApp({ DATABASE_URL: url.toString() });
  await applyMigrations(app.ctx.db);
  return {
    ...app,
    close: async () => {
      await app.close();
      await root.query(`DROP DATABASE IF EXISTS \`${database}\``);
      await root.end();
    },
  };
}
