import { describe, expect, test } from 'vitest';
import { nextStepSentence, nextSteps, type NextStepLinks } from './next-steps';
import { detunedBank, detunedTuning, noBands, siteHealthFixture, step, undetunedBank } from './site-health-fixture';

const links: NextStepLinks = {
  flagQueue: (siteId, kind) => `/flags?siteId=${siteId}${kind ? `&kind=${kind}` : ''}`,
  siteRecord: (id) => `/sites/${id}`,
  step: (id) => `/steps/${id}`,
  bank: (id) => `/banks/${id}`,
  workOrder: (id) => `/work-orders/${id}`,
};
const plain = (text: string) => text.replace(/\u00A0/g, ' ');
const sentences = (input: Parameters<typeof nextSteps>[0]) => nextSteps(input).map((s) => plain(nextStepSentence(s)));

describe('nextSteps', () => {
  test('with no readings yet it says so, and says what the load leaves undone', () => {
    const health = siteHealthFixture();
    const steps = nextSteps({ health, links, locale: 'en-GB' });
    expect(steps.at(-1)).toMatchObject({ id: 'no-reading', urgency: 'note' });
    expect(plain(steps.at(-1)!.text)).toBe('No reading yet: every figure assumes each unit still delivers its nameplate kvar until the first inspection is recorded');
    // [DERIVED] §6 (fixture): PF 0.876 at 500 kW, 110.7 kvar short of 0.95 with nothing lost.
    expect(sentences({ health, links, locale: 'en-GB' })).toContain(
      'PF 0.876 is below the target 0.95, 110.7 kvar missing: nothing is lost, so the bank is too small for this load: add 110.7 kvar',
    );
  });

  test('units in the replace band come first and lead to the flag queue', () => {
    const health = siteHealthFixture({ bands: { ...noBands(), replace: 2, healthy: 2 }, targetMet: true, reachedPf: 0.96, missingKvar: 0 });
    const [first] = nextSteps({ health, links });
    expect(plain(nextStepSentence(first!))).toBe('2 units in the replace band — open the flag queue');
    expect(first).toMatchObject({ urgency: 'act', link: { href: '/flags?siteId=7&kind=replace' } });
  });

  test('a detuned step drifting towards the 5th is named with its tuning, the distance and its design', () => {
    const health = siteHealthFixture({ banks: [detunedBank(0.88)], bands: { ...noBands(), healthy: 5, watch: 1 } });
    const tuning = nextSteps({ health, links, locale: 'en-GB' }).find((s) => s.id === 'tuning-206')!;
    // [COMMON] §4: 12 % lost on a 7 % step → 201.5 Hz, +6.6 % over 189.0 Hz, 19 % below 250 Hz.
    expect(plain(tuning.text)).toBe(
      'Step 6 of Bank A tuned at 201 Hz, 19 % from the 5th, up 6.6 % from its design 189 Hz as its capacitors lose capacitance: plan their replacement',
    );
    expect(tuning).toMatchObject({ urgency: 'plan', link: { href: '/steps/206', label: 'open step 6' } });
  });

  test('a step tuned within 10 % of the 5th is an action', () => {
    const bank = detunedBank();
    // k = 0.6: 189.0/√0.6 = 244 Hz, 2.4 % from 250 Hz.
    bank.steps[2] = step({ ...bank.steps[2]!, tuning: detunedTuning(0.6) });
    const health = siteHealthFixture({ banks: [bank], bands: { ...noBands(), healthy: 6 } });
    const [first] = nextSteps({ health, links, locale: 'en-GB' });
    expect(first!.urgency).toBe('act');
    expect(plain(first!.text)).toMatch(/^Step 3 of Bank A tuned at 244 Hz, 2 % from the 5th \(250 Hz\)/);
  });

  test('a step combination resonating near a characteristic harmonic is named with its steps and order', () => {
    const health = siteHealthFixture({ bands: { ...noBands(), healthy: 4 } });
    const resonance = nextSteps({ health, links, locale: 'en-GB' }).find((s) => s.id === 'resonance-10')!;
    // [DERIVED] §5: √(16 667/100) = 12.9, 0.7 % from the 13th.
    expect(plain(resonance.text)).toBe(
      'Bank B resonates with the supply with steps 1–4 in (100.0 kvar) at order 12.9, 1 % from the 13th: check the voltage distortion at those steps and consider detuned steps',
    );
    expect(resonance.link).toEqual({ href: '/banks/10', label: 'open Bank B' });
  });

  test('a leading PF is shown as a fault, first of all', () => {
    const health = siteHealthFixture({ reachedPf: 0.985, leading: true, targetMet: false, bands: { ...noBands(), healthy: 4 } });
    const [first] = nextSteps({ health, links, locale: 'en-GB' });
    expect(first).toMatchObject({ id: 'leading', urgency: 'act' });
    expect(plain(first!.text)).toContain('PF 0.985 leading');
  });

  test('a lost correction that would meet the target says so, with the estimated cost', () => {
    const health = siteHealthFixture({
      lostKvar: 40,
      missingKvar: 30,
      bands: { ...noBands(), healthy: 3, replace: 1 },
      cost: { ...siteHealthFixture().cost!, lostMonthlyCost: 123.4 },
    });
    const all = sentences({ health, links, locale: 'en-GB' });
    expect(all).toContain('PF 0.876 is below the target 0.95, 30.0 kvar missing: restoring the 40.0 kvar lost would meet it');
    expect(all).toContain('The lost correction costs an estimated 123 EUR a month at 500 hours of load');
  });

  test('the site’s overdue orders lead to their pages', () => {
    const health = siteHealthFixture({
      bands: { ...noBands(), healthy: 4 },
      targetMet: true,
      overdueOrders: [{ id: 31, title: 'Half-yearly inspection', dueOn: '2026-11-10', state: 'dispatched' }],
    });
    const overdue = nextSteps({ health, links }).filter((s) => s.id.startsWith('overdue-'));
    expect(overdue).toEqual([
      { id: 'overdue-31', urgency: 'plan', text: '“Half-yearly inspection” was due on 2026-11-10 and is still dispatched', link: { href: '/work-orders/31', label: 'open the order' } },
    ]);
  });

  test('open flags the bands do not count become steps: an action flag now, one in hand leads to its order', () => {
    const flag = { severity: 'action' as const, bankId: 20, bankName: 'Pump hall bank', target: 'contactor', targetId: 5, state: 'open' as const, correctiveOrderId: null, raisedAt: '2026-11-01T08:00:00.000Z' };
    const health = siteHealthFixture({
      bands: { ...noBands(), healthy: 4 },
      targetMet: true,
      reachedPf: 0.96,
      missingKvar: 0,
      banks: [undetunedBank({ resonance: [] })],
      openFlags: [
        { ...flag, id: 1, kind: 'contactor-endurance', message: 'Step 2 contactor has used 85.2 % of its rated 100000 operations.' },
        { ...flag, id: 2, kind: 'blown-fuse', target: 'fuse-set', message: 'Step 3, fuse 2 without continuity.', state: 'in-hand', correctiveOrderId: 25 },
        { ...flag, id: 3, kind: 'replace', target: 'capacitor-unit', message: 'Counted by the replace band already.' },
      ],
    });
    const steps = nextSteps({ health, links });
    expect(steps.filter((s) => s.id.startsWith('flag-'))).toEqual([
      {
        id: 'flag-1',
        urgency: 'act',
        text: 'Contactor endurance on Pump hall bank: Step 2 contactor has used 85.2 % of its rated 100000 operations',
        link: { href: '/flags?siteId=7&kind=contactor-endurance', label: 'open the flag queue' },
      },
      {
        id: 'flag-2',
        urgency: 'plan',
        text: 'Blown fuse on Pump hall bank: Step 3, fuse 2 without continuity; a corrective order has it in hand',
        link: { href: '/work-orders/25', label: 'open order #25' },
      },
    ]);
    expect(steps.some((s) => s.id === 'all-well')).toBe(false);
  });

  test('all well: one sentence says nothing needs doing', () => {
    const health = siteHealthFixture({ bands: { ...noBands(), healthy: 4 }, targetMet: true, reachedPf: 0.96, missingKvar: 0, banks: [undetunedBank({ resonance: [] })] });
    expect(sentences({ health, links })).toEqual(['Nothing needs doing now: every unit reads healthy and the target PF is met']);
  });

  test('no load known and no bank: it says what is missing and where to add it', () => {
    const noLoad = siteHealthFixture({ load: null, reachedPf: null, leading: null, missingKvar: null, requiredKvar: null, targetMet: null, triangle: null, cost: null });
    expect(nextSteps({ health: noLoad, links }).find((s) => s.id === 'no-load')!.link).toEqual({ href: '/sites/7', label: 'open the site record' });
    const noBank = siteHealthFixture({ banks: [], bands: noBands() });
    expect(nextSteps({ health: noBank, links }).map((s) => s.id)).toEqual(['no-bank']);
  });
});
