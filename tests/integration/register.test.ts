import { ratedCapacitanceUF } from '@varden/engineering';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { createUser, signIn } from '../support/factories';
import { startTestApp, unique, type TestApp } from '../support/test-app';

let app: TestApp;
let planner: string;
let technician: string;
let admin: string;

beforeAll(async () => {
  app = await startTestApp();
  const [p, t, a] = await Promise.all([
    createUser(app.ctx, { roles: ['planner'] }),
    createUser(app.ctx, { roles: ['technician'] }),
    createUser(app.ctx, { roles: ['admin'] }),
  ]);
  [planner, technician, admin] = await Promise.all([
    signIn(app, p.email, p.password),
    signIn(app, t.email, t.password),
    signIn(app, a.email, a.password),
  ]);
});
afterAll(async () => {
  await app.close();
});

const siteBody = (over: Record<string, unknown> = {}) => ({
  name: unique('Site'),
  address: '1 Test Quay',
  voltageV: 400,
  frequencyHz: 50,
  transformerKva: 1600,
  transformerImpedancePct: 6,
  targetPf: 0.95,
  tariffBasis: 'tan-phi-limit',
  tariffLimit: 0.4,
  pricePerKvarh: 0.02,
  currency: 'EUR',
  ...over,
});

async function post(path: string, json: unknown, cookie = planner) {
  const res = await app.request(path, { method: 'POST', json, cookie });
  return { status: res.status, body: await res.json() };
}

async function makeStep(over: { detuned?: boolean } = {}) {
  const site = (await post('/api/sites', siteBody())).body;
  const bank = (
    await post('/api/banks', {
      siteId: site.id,
      name: 'Bank A',
      detuned: over.detuned ?? false,
      detuningFactor: over.detuned ? 0.07 : null,
    })
  ).body;
  const step = (await post('/api/steps', { bankId: bank.id, number: 1, ratedKvar: 50 })).body;
  return { site, bank, step };
}

describe('sites', () => {
  test('a planner creates a site and reads it back with its voltage and frequency', async () => {
    const body = siteBody();
    const created = await post('/api/sites', body);
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ ...body, id: expect.any(Number), version: 1, bankCount: 0, retiredAt: null });

    const list = await app.request(`/api/sites?q=${encodeURIComponent(body.name)}`, { cookie: technician });
    expect(list.status).toBe(200);
    const page = await list.json();
    expect(page.total).toBe(1);
    expect(page.items[0]).toMatchObject({ id: created.body.id, voltageV: 400, frequencyHz: 50, bankCount: 0 });
  });

  test('invalid input gets 400 with a message per field and stores nothing', async () => {
    const name = unique('Bad');
    const res = await post('/api/sites', siteBody({ name, frequencyHz: 55, voltageV: -400, targetPf: 1.2 }));
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid');
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['frequencyHz', 'targetPf', 'voltageV']);
    const list = await (await app.request(`/api/sites?q=${name}`, { cookie: planner })).json();
    expect(list.total).toBe(0);
  });

  test('a technician may read but not write the register', async () => {
    const res = await post('/api/sites', siteBody(), technician);
    expect(res.status).toBe(403);
  });

  test('an administrator may write the register', async () => {
    const res = await post('/api/sites', siteBody(), admin);
    expect(res.status).toBe(201);
  });

  test('a stale version gets 409 and the first change stays', async () => {
    const site = (await post('/api/sites', siteBody())).body;
    const first = await app.request(`/api/sites/${site.id}`, { method: 'PATCH', json: { version: 1, address: 'First' }, cookie: planner });
    expect(first.status).toBe(200);
    expect((await first.json()).version).toBe(2);
    const stale = await app.request(`/api/sites/${site.id}`, { method: 'PATCH', json: { version: 1, address: 'Second' }, cookie: planner });
    expect(stale.status).toBe(409);
    const now = await (await app.request(`/api/sites/${site.id}`, { cookie: planner })).json();
    expect(now.address).toBe('First');
  });

  test('a patch leaves the fields it does not name as they were', async () => {
    const site = (await post('/api/sites', siteBody({ address: 'Keep me', currency: 'GBP' }))).body;
    const res = await app.request(`/api/sites/${site.id}`, { method: 'PATCH', json: { version: 1, name: unique('Renamed') }, cookie: planner });
    expect(await res.json()).toMatchObject({ address: 'Keep me', currency: 'GBP', timeZone: 'UTC' });
  });

  test('deleting a site with banks is refused with 409; retiring it hides it from the list', async () => {
    const { site } = await makeStep();
    const del = await app.request(`/api/sites/${site.id}`, { method: 'DELETE', cookie: planner });
    expect(del.status).toBe(409);
    expect((await del.json()).error.message).toMatch(/retire/i);
    const retired = await app.request(`/api/sites/${site.id}`, { method: 'PATCH', json: { version: 1, retired: true }, cookie: planner });
    expect((await retired.json()).retiredAt).not.toBeNull();
    const list = await (await app.request(`/api/sites?q=${encodeURIComponent(site.name)}`, { cookie: planner })).json();
    expect(list.total).toBe(0);
  });

  test('a duplicate name is a 409 with the field named', async () => {
    const body = siteBody();
    await post('/api/sites', body);
    const again = await post('/api/sites', body);
    expect(again.status).toBe(409);
    expect(again.body.error.fields).toHaveProperty('name');
  });
});

describe('banks and steps', () => {
  test('a detuned bank needs its detuning factor', async () => {
    const site = (await post('/api/sites', siteBody())).body;
    const res = await post('/api/banks', { siteId: site.id, name: 'B', detuned: true });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty('detuningFactor');
  });

  test('steps are numbered once per bank; sites and banks count their children', async () => {
    const { bank, site } = await makeStep();
    await post('/api/banks', { siteId: site.id, name: 'Bank B' });
    const listed = await (await app.request(`/api/sites?q=${encodeURIComponent(site.name)}`, { cookie: planner })).json();
    expect(listed.items[0].bankCount).toBe(2);
    expect((await (await app.request(`/api/banks/${bank.id}`, { cookie: planner })).json()).stepCount).toBe(1);
    const again = await post('/api/steps', { bankId: bank.id, number: 1, ratedKvar: 25 });
    expect(again.status).toBe(409);
    const list = await (await app.request(`/api/steps?bankId=${bank.id}`, { cookie: technician })).json();
    expect(list).toMatchObject({ total: 1, items: [{ number: 1, ratedKvar: 50 }] });
  });
});

describe('capacitor units', () => {
  test('the rated capacitance is computed from the nameplate when not given', async () => {
    const { step } = await makeStep();
    const res = await post('/api/capacitor-units', {
      stepId: step.id,
      position: 1,
      nameplateKvar: 50,
      nameplateVoltageV: 400,
      nameplateFrequencyHz: 50,
      connection: 'delta',
    });
    expect(res.status).toBe(201);
    // [DERIVED] engineering-reference.md §1: 50 kvar 400 V 50 Hz delta → C_Δ = 331.57 µF per leg.
    expect(res.body.capacitanceUF).toBeCloseTo(331.57, 2);
    expect(res.body).toMatchObject({ capacitanceGiven: false, warnings: [], toleranceMinusPct: -5, tolerancePlusPct: 10 });
  });

  test('a given capacitance more than 2 % from the nameplate is kept with a warning', async () => {
    const { step } = await makeStep();
    const expected = ratedCapacitanceUF({ kvar: 25, voltageV: 400, frequencyHz: 50, connection: 'delta' });
    const res = await post('/api/capacitor-units', {
      stepId: step.id,
      position: 2,
      nameplateKvar: 25,
      nameplateVoltageV: 400,
      nameplateFrequencyHz: 50,
      connection: 'delta',
      capacitanceUF: expected * 1.05,
      tolerancePreset: 'ieee',
    });
    expect(res.status).toBe(201);
    expect(res.body.capacitanceUF).toBeCloseTo(expected * 1.05, 6);
    expect(res.body.warnings).toHaveLength(1);
    expect(res.body.warnings[0]).toMatch(/5\.0 %/);
    expect(res.body).toMatchObject({ toleranceMinusPct: 0, tolerancePlusPct: 10 });
  });

  test('a position holds one unit in service; replacing moves the position on', async () => {
    const { step } = await makeStep();
    const nameplate = { nameplateKvar: 25, nameplateVoltageV: 400, nameplateFrequencyHz: 50, connection: 'delta' };
    const first = (await post('/api/capacitor-units', { stepId: step.id, position: 1, serial: 'OLD-1', ...nameplate })).body;
    const clash = await post('/api/capacitor-units', { stepId: step.id, position: 1, ...nameplate });
    expect(clash.status).toBe(409);

    const replaced = await post(`/api/capacitor-units/${first.id}/replacement`, {
      version: first.version,
      removedOn: '2026-11-20',
      reason: 'Over-pressure disconnector operated',
      replacement: { serial: 'NEW-1', ...nameplate },
    });
    expect(replaced.status).toBe(201);
    expect(replaced.body.removed).toMatchObject({ removedOn: '2026-11-20', removalReason: 'Over-pressure disconnector operated' });
    expect(replaced.body.installed).toMatchObject({ position: 1, serial: 'NEW-1', installedOn: '2026-11-20' });
    expect(replaced.body.removed.replacedById).toBe(replaced.body.installed.id);

    const inService = await (await app.request(`/api/capacitor-units?stepId=${step.id}`, { cookie: planner })).json();
    expect(inService.items.map((u: { serial: string }) => u.serial)).toEqual(['NEW-1']);
    const all = await (await app.request(`/api/capacitor-units?stepId=${step.id}&includeRemoved=true`, { cookie: planner })).json();
    expect(all.total).toBe(2);
  });

  test('an unknown connection is refused with the field named', async () => {
    const { step } = await makeStep();
    const res = await post('/api/capacitor-units', {
      stepId: step.id,
      position: 1,
      nameplateKvar: 25,
      nameplateVoltageV: 400,
      nameplateFrequencyHz: 50,
      connection: 'zigzag',
    });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty('connection');
  });
});

describe('contactors, reactors and fuse sets', () => {
  test('each can be created, read, changed and listed per step', async () => {
    const { step, bank } = await makeStep({ detuned: true });
    const bodies = {
      contactors: { stepId: step.id, ratedOperations: 100_000, counterAtInstall: 120 },
      reactors: { stepId: step.id, inductanceMH: 0.7, ratedCurrentA: 90, detuningFactor: 0.07 },
      'fuse-sets': { stepId: step.id, ratedCurrentA: 125, type: 'gG' },
    };
    for (const [kind, body] of Object.entries(bodies)) {
      const created = await post(`/api/${kind}`, body);
      expect(created.status, kind).toBe(201);
      expect(created.body).toMatchObject(body);
      const patched = await app.request(`/api/${kind}/${created.body.id}`, {
        method: 'PATCH',
        json: { version: 1, removedOn: '2026-10-01' },
        cookie: planner,
      });
      expect(patched.status, kind).toBe(200);
      expect((await patched.json()).removedOn).toBe('2026-10-01');
      const list = await (await app.request(`/api/${kind}?bankId=${bank.id}`, { cookie: technician })).json();
      expect(list.total, kind).toBe(0);
    }
  });
});

describe('viewers', () => {
  test('a viewer reads only the sites granted to them, and others look missing', async () => {
    const granted = (await post('/api/sites', siteBody())).body;
    const other = (await post('/api/sites', siteBody())).body;
    const viewer = await createUser(app.ctx, { roles: ['viewer'], siteIds: [granted.id] });
    const cookie = await signIn(app, viewer.email, viewer.password);
    const list = await (await app.request('/api/sites?pageSize=200', { cookie })).json();
    expect(list.items.map((s: { id: number }) => s.id)).toEqual([granted.id]);
    expect((await app.request(`/api/sites/${granted.id}`, { cookie })).status).toBe(200);
    expect((await app.request(`/api/sites/${other.id}`, { cookie })).status).toBe(404);
  });
});

describe('CSV import of a bank register', () => {
  const header = 'step,step_kvar,position,kvar,voltage_v,frequency_hz,connection,capacitance_uf,serial,maker,model,installed_on';
  const importCsv = async (bankId: number, csv: string, dryRun: boolean) => {
    const res = await app.request(`/api/banks/${bankId}/register-import`, { method: 'POST', json: { csv, dryRun }, cookie: planner });
    return { status: res.status, body: await res.json() };
  };
  const countUnits = async (bankId: number) =>
    (await (await app.request(`/api/capacitor-units?bankId=${bankId}`, { cookie: planner })).json()).total as number;

  test('a valid file previews, then imports steps and units all at once', async () => {
    const { bank } = await makeStep();
    const csv = [header, '1,50,1,25,400,50,delta,,A-1,,,2024-03-01', '1,50,2,25,400,50,delta,,A-2,,,', '2,50,1,50,400,50,delta,,B-1,,,'].join('\n');
    const preview = await importCsv(bank.id, csv, true);
    expect(preview.status).toBe(200);
    expect(preview.body).toEqual({
      rows: [
        { line: 2, errors: [] },
        { line: 3, errors: [] },
        { line: 4, errors: [] },
      ],
      created: { steps: 1, units: 3 },
      dryRun: true,
    });
    expect(await countUnits(bank.id)).toBe(0);
    const done = await importCsv(bank.id, csv, false);
    expect(done.status).toBe(200);
    expect(await countUnits(bank.id)).toBe(3);
  });

  test('a missing column is named and nothing is written', async () => {
    const { bank } = await makeStep();
    const res = await importCsv(bank.id, 'step,step_kvar,position,kvar,voltage_v,frequency_hz\n1,50,1,25,400,50', false);
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/connection/);
    expect(await countUnits(bank.id)).toBe(0);
  });

  test('bad numbers, unknown connections and duplicate positions are listed per row; nothing is written', async () => {
    const { bank } = await makeStep();
    const csv = [header, '1,50,1,25,400,50,delta,,,,,', '1,50,2,twenty,400,50,delta,,,,,', '1,50,3,25,400,50,zigzag,,,,,', '1,50,1,25,400,50,delta,,,,,'].join('\n');
    const res = await importCsv(bank.id, csv, false);
    expect(res.status).toBe(400);
    const rows = res.body.error.rows as Array<{ line: number; errors: string[] }>;
    expect(rows[0]).toEqual({ line: 2, errors: [] });
    expect(rows[1]!.errors.join(' ')).toMatch(/kvar “twenty” is not a number/);
    expect(rows[2]!.errors.join(' ')).toMatch(/connection/i);
    expect(rows[3]!.errors.join(' ')).toMatch(/also on line 2/);
    expect(await countUnits(bank.id)).toBe(0);
  });

  test('a position already in service is refused', async () => {
    const { bank, step } = await makeStep();
    await post('/api/capacitor-units', { stepId: step.id, position: 1, nameplateKvar: 25, nameplateVoltageV: 400, nameplateFrequencyHz: 50, connection: 'delta' });
    const res = await importCsv(bank.id, [header, '1,50,1,25,400,50,delta,,,,,'].join('\n'), true);
    expect(res.status).toBe(400);
    expect(res.body.error.rows[0].errors.join(' ')).toMatch(/already holds a unit/);
  });
});
