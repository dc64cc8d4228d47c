import { ratedCapacitanceUF, reactorInductanceMH, type Connection } from '@varden/engineering';
import type { AppContext } from '../context';
import { eq } from 'drizzle-orm';
import { banks, capacitorUnits, contactors, fuseSets, reactors, sites, steps, users, viewerSiteGrants } from '../db/schema/index';
import { demoViewerSites } from '../modules/users/demo-accounts';
import { prepareUnitValues } from '../modules/register/units.service';

/**
 * The demo register (../shared/demo-scenario.md): Korvel Field Services' three client sites.
 * Every name, serial and date is invented.
 */

interface BankPlan {
  name: string;
  location: string;
  commissionedOn: string;
  detuningFactor: number | null;
  steps: number;
  stepKvar: number;
  /** Capacitor units per step and each one's nameplate. */
  units: { count: number; kvar: number; voltageV: number; serialPrefix: string; maker: string; model: string; temperatureCategory: string };
  contactorRatedOperations: number;
  /** Operations already counted when each step's contactor was fitted. */
  contactorCounterAtInstall: number;
  fuseA: number;
  reactorRatedCurrentA: number | null;
}

interface SitePlan {
  site: typeof sites.$inferInsert;
  banks: BankPlan[];
}

export const demoSites: SitePlan[] = [
  {
    site: {
      name: 'Alder Quay Cold Store',
      address: 'Berth 4, Alder Quay Industrial Estate',
      voltageV: 400,
      frequencyHz: 50,
      transformerKva: 1600,
      transformerImpedancePct: 6,
      targetPf: 0.95,
      tariffBasis: 'tan-phi-limit',
      tariffLimit: 0.4,
      pricePerKvarh: 0.018,
      currency: 'EUR',
      timeZone: 'Europe/Dublin',
      plannedLoadKw: 620,
      plannedLoadPf: 0.78,
    },
    banks: [
      {
        name: 'Bank A',
        location: 'Main switchroom, panel MS-3',
        commissionedOn: '2021-05-17',
        detuningFactor: 0.07,
        steps: 6,
        stepKvar: 50,
        units: { count: 2, kvar: 28, voltageV: 440, serialPrefix: 'AQ-A', maker: 'Thornfield Capacitors', model: 'TF-440/28', temperatureCategory: '-25/D' },
        contactorRatedOperations: 100_000,
        contactorCounterAtInstall: 0,
        fuseA: 125,
        reactorRatedCurrentA: 80,
      },
      {
        name: 'Bank B',
        location: 'Plant room 2',
        commissionedOn: '2019-09-02',
        detuningFactor: null,
        steps: 4,
        stepKvar: 25,
        units: { count: 1, kvar: 25, voltageV: 400, serialPrefix: 'AQ-B', maker: 'Thornfield Capacitors', model: 'TF-400/25', temperatureCategory: '-25/D' },
        contactorRatedOperations: 100_000,
        contactorCounterAtInstall: 0,
        fuseA: 63,
        reactorRatedCurrentA: null,
      },
    ],
  },
  {
    site: {
      name: 'Brinmoor Pumping Station',
      address: 'Brinmoor Lane, Lower Weir',
      voltageV: 400,
      frequencyHz: 50,
      transformerKva: 1000,
      transformerImpedancePct: 6,
      targetPf: 0.9,
      tariffBasis: 'pf-threshold',
      tariffLimit: 0.9,
      pricePerKvarh: 0.021,
      currency: 'EUR',
      timeZone: 'Europe/Dublin',
      plannedLoadKw: 410,
      plannedLoadPf: 0.74,
    },
    banks: [
      {
        name: 'Pump hall bank',
        location: 'Pump hall MCC room',
        commissionedOn: '2020-03-09',
        detuningFactor: 0.14,
        steps: 5,
        stepKvar: 40,
        units: { count: 1, kvar: 49.5, voltageV: 480, serialPrefix: 'BM', maker: 'Keswell Electric', model: 'KE-480/50', temperatureCategory: '-25/D' },
        contactorRatedOperations: 100_000,
        contactorCounterAtInstall: 0,
        fuseA: 100,
        reactorRatedCurrentA: 70,
      },
    ],
  },
  {
    site: {
      name: 'Castellan Polymers, Plant 2',
      address: '2200 Resin Way, Castellan Park',
      voltageV: 480,
      frequencyHz: 60,
      transformerKva: 1250,
      transformerImpedancePct: 6,
      targetPf: 0.95,
      tariffBasis: 'pf-threshold',
      tariffLimit: 0.95,
      pricePerKvarh: 0.012,
      currency: 'USD',
      timeZone: 'America/Chicago',
      plannedLoadKw: 880,
      plannedLoadPf: 0.8,
    },
    banks: [
      {
        name: 'Extruder bank',
        location: 'Extrusion hall, north wall',
        commissionedOn: '2018-11-12',
        detuningFactor: null,
        steps: 8,
        stepKvar: 50,
        units: { count: 1, kvar: 50, voltageV: 480, serialPrefix: 'CP', maker: 'Keswell Electric', model: 'KE-480/50-60', temperatureCategory: '-25/C' },
        contactorRatedOperations: 200_000,
        contactorCounterAtInstall: 0,
        fuseA: 100,
        reactorRatedCurrentA: null,
      },
    ],
  },
];

export async function seedDemoRegister(ctx: AppContext): Promise<void> {
  const { db } = ctx;
  await db.transaction(async (tx) => {
    for (const plan of demoSites) {
      const [site] = await tx.insert(sites).values(plan.site).$returningId();
      for (const b of plan.banks) {
        const [bank] = await tx
          .insert(banks)
          .values({
            siteId: site!.id,
            name: b.name,
            location: b.location,
            controllerTargetPf: plan.site.targetPf,
            detuned: b.detuningFactor !== null,
            detuningFactor: b.detuningFactor,
            commissionedOn: b.commissionedOn,
          })
          .$returningId();
        for (let n = 1; n <= b.steps; n++) {
          const [step] = await tx.insert(steps).values({ bankId: bank!.id, number: n, ratedKvar: b.stepKvar }).$returningId();
          const nameplate = {
            nameplateKvar: b.units.kvar,
            nameplateVoltageV: b.units.voltageV,
            nameplateFrequencyHz: plan.site.frequencyHz as 50 | 60,
            connection: 'delta' as Connection,
          };
          for (let position = 1; position <= b.units.count; position++) {
            await tx.insert(capacitorUnits).values({
              stepId: step!.id,
              position,
              ...prepareUnitValues({
                ...nameplate,
                capacitanceUF: null,
                tolerancePreset: 'iec',
                temperatureCategory: b.units.temperatureCategory,
                dischargeTimeS: 180,
                serial: `${b.units.serialPrefix}-${String(n).padStart(2, '0')}${String(position).padStart(1, '0')}-${2400 + n * 7 + position}`,
                maker: b.units.maker,
                model: b.units.model,
                installedOn: b.commissionedOn,
              }),
            });
          }
          await tx.insert(contactors).values({
            stepId: step!.id,
            ratedOperations: b.contactorRatedOperations,
            counterAtInstall: b.contactorCounterAtInstall,
            maker: 'Harrowgate Switchgear',
            model: 'HS-C6b',
            installedOn: b.commissionedOn,
          });
          await tx.insert(fuseSets).values({ stepId: step!.id, ratedCurrentA: b.fuseA, type: 'gG', installedOn: b.commissionedOn });
          if (b.detuningFactor !== null && b.reactorRatedCurrentA !== null) {
            // The reactor is sized for the step's capacitors in parallel: L = p / (ω²·3·C_Δ).
            const legUF =
              ratedCapacitanceUF({ kvar: b.units.kvar, voltageV: b.units.voltageV, frequencyHz: plan.site.frequencyHz, connection: 'delta' }) *
              b.units.count;
            await tx.insert(reactors).values({
              stepId: step!.id,
              inductanceMH: reactorInductanceMH({ detuningFactor: b.detuningFactor, legsUF: [legUF, legUF, legUF], frequencyHz: plan.site.frequencyHz }),
              ratedCurrentA: b.reactorRatedCurrentA,
              detuningFactor: b.detuningFactor,
              maker: 'Ostrand Magnetics',
              model: `OM-${Math.round(b.detuningFactor * 100)}`,
              installedOn: b.commissionedOn,
            });
          }
        }
      }
    }
  });
}

/** Grants each demo viewer (a client's facility manager) the site they look after. */
export async function grantDemoViewerSites(ctx: AppContext): Promise<void> {
  for (const [email, siteName] of Object.entries(demoViewerSites)) {
    const [user] = await ctx.db.select({ id: users.id }).from(users).where(eq(users.email, email));
    const [site] = await ctx.db.select({ id: sites.id }).from(sites).where(eq(sites.name, siteName));
    if (user && site) await ctx.db.insert(viewerSiteGrants).ignore().values({ userId: user.id, siteId: site.id });
  }
}
