import { storedEnergyJ } from '@varden/engineering';
import type { SafetyCard, WalkthroughBank } from '@varden/schemas';

/**
 * Without a registered discharge time, the card asks for five minutes: the upper end of the
 * low-voltage requirements in engineering-reference.md §3 (IEC 60831-1 three minutes, NEC 460
 * one minute) and the lower end of medium-voltage practice (§8).
 */
export const cautiousDischargeWaitS = 300;

const minutes = (s: number) => (s % 60 === 0 ? `${s / 60} min` : s > 60 ? `${Math.floor(s / 60)} min ${s % 60} s` : `${s} s`);

/** Energy one element holds at rated voltage: a delta leg or single element sees the line voltage, a star phase U/√3. */
function elementEnergyJ(u: WalkthroughBank['steps'][number]['units'][number]): number {
  const voltageV = u.connection === 'star' ? u.nameplateVoltageV / Math.sqrt(3) : u.nameplateVoltageV;
  return storedEnergyJ({ capacitanceUF: u.capacitanceUF, voltageV });
}

/**
 * The safety card of an order on this bank (engineering-reference.md §8, product.md "Safety").
 * It reminds; it does not replace the site's procedure, local codes or licensed practice.
 */
export function safetyCardFor(
  bank: WalkthroughBank,
  acknowledged: { at: Date | null; byName: string | null },
): SafetyCard {
  const units = bank.steps.flatMap((s) => s.units);
  const fromNameplates = units.length > 0;
  const dischargeWaitS = fromNameplates ? Math.max(...units.map((u) => u.dischargeTimeS)) : cautiousDischargeWaitS;
  const maxStoredEnergyJ = fromNameplates ? Math.max(...units.map(elementEnergyJ)) : null;
  const wait = minutes(dischargeWaitS);
  return {
    dischargeWaitS,
    dischargeWaitFromNameplates: fromNameplates,
    maxStoredEnergyJ,
    steps: [
      {
        title: 'Isolate and lock out',
        text: `Isolate ${bank.name} from every source of supply, including the controller's auxiliary supply, and lock and tag out each isolation point as the site's rules require.`,
      },
      {
        title: `Wait ${wait}`,
        text: fromNameplates
          ? `Capacitors hold their charge after isolation. Wait at least ${wait}, the longest rated discharge time on this bank's nameplates, before opening any cover.`
          : `No discharge time is registered for this bank's units. Wait at least ${wait} before opening any cover, longer if the nameplates on site say so.`,
      },
      {
        title: 'Verify absence of voltage',
        text: 'Test every terminal, phase to phase and phase to earth, with a voltage tester proved on a known source before and after the test.',
      },
      {
        title: 'Discharge, short and earth',
        text: 'Discharge each unit terminal to terminal and to case with a grounding stick, then fit shorts and earths and keep them on while you work. Discharge again after any insulation test. Never pull fuses by hand before the bank is discharged.',
      },
      {
        title: 'Wear the right PPE',
        text: 'Wear the protective equipment the site’s arc-flash assessment sets for this equipment.',
      },
    ],
    ppeNote:
      'The PPE for this work comes from the site’s arc-flash risk assessment (NFPA 70E in the US; EN 50110-1 and its five safety rules in Europe) and your local codes, not from Varden.',
    deferral:
      'This card is a reminder, not a procedure. Local codes, the site’s safety rules and licensed practice prevail wherever they differ from it or ask for more.',
    acknowledgedAt: acknowledged.at ? acknowledged.at.toISOString() : null,
    acknowledgedByName: acknowledged.byName,
  };
}
