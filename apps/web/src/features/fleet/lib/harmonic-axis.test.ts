import { describe, expect, test } from 'vitest';
import {
  assignLanes,
  axisLastOrder,
  beyondOrder,
  harmonicAxisMarkers,
  harmonicAxisSummary,
  harmonicTicks,
  labelExtent,
  needsThirdHarmonic,
  orderX,
} from './harmonic-axis';
import { detunedBank, siteHealthFixture, undetunedBank } from './site-health-fixture';

const plain = (text: string) => text.replace(/\u00A0/g, ' ');

describe('harmonicTicks', () => {
  test('orders 1 to 15 with the 5th, 7th, 11th and 13th marked [COMMON] §5', () => {
    const ticks = harmonicTicks(50, false);
    expect(ticks.map((t) => t.order)).toEqual(Array.from({ length: 15 }, (_, i) => i + 1));
    expect(ticks.filter((t) => t.characteristic).map((t) => t.order)).toEqual([5, 7, 11, 13]);
    expect(ticks[4]!.hz).toBe(250);
  });

  test('the 3rd joins them where a bank is detuned for it (14 %) [COMMON] §4', () => {
    expect(harmonicTicks(60, true).filter((t) => t.characteristic).map((t) => t.order)).toEqual([3, 5, 7, 11, 13]);
    const fourteen = { ...detunedBank(), detuningFactor: 0.14 };
    expect(needsThirdHarmonic({ banks: [fourteen] })).toBe(true);
    expect(needsThirdHarmonic({ banks: [detunedBank(), undetunedBank()] })).toBe(false);
  });
});

describe('harmonicAxisMarkers', () => {
  test('places each switched combination at its resonance order; those past the 15th share one marker at the end', () => {
    const markers = harmonicAxisMarkers(siteHealthFixture(), 'en-GB').filter((m) => m.kind === 'resonance');
    // [DERIVED] §5: h = √(16 667/Q): 75 kvar → 14.91, 100 kvar → 12.91 (warning, 13th); 25 and 50 kvar past 15.
    expect(markers).toHaveLength(3);
    const [threeSteps, fourSteps, beyond] = markers;
    expect(threeSteps!.order).toBeCloseTo(Math.sqrt(1000 / 0.06 / 75), 9);
    expect(threeSteps).toMatchObject({ warning: false, beyond: false, steps: 'steps 1–3' });
    expect(fourSteps!.order).toBeCloseTo(12.91, 2);
    expect(fourSteps).toMatchObject({ warning: true, nearestHarmonic: 13, label: 'Bank B 1–4 near 13th' });
    expect(plain(fourSteps!.description)).toBe('Bank B, steps 1–4 in (100.0 kvar): resonance with the supply at order 12.91, within 1 % of the 13th');
    expect(beyond).toMatchObject({ beyond: true, shownOrder: beyondOrder, steps: 'step 1, steps 1 and 2' });
    expect(beyond!.order).toBeCloseTo(18.26, 2);
    expect(plain(beyond!.label)).toBe('Bank B: 2 combinations at 18.3–25.8');
  });

  test('names the step numbers the API reports, so a dead step that dropped out is not counted', () => {
    const bank = undetunedBank();
    bank.steps[0] = { ...bank.steps[0]!, effectiveKvar: 0 };
    bank.resonance = [{ stepNumbers: [2, 3, 4], kvar: 75, order: 14.91, nearestHarmonic: 13, distancePct: 14.7, warning: false }];
    const [marker] = harmonicAxisMarkers({ frequencyHz: 50, banks: [bank] });
    expect(marker!.steps).toBe('steps 2–4');
  });

  test('detuned steps tuned alike share a marker; a drifted step gets its own beside the bank’s design', () => {
    const markers = harmonicAxisMarkers({ frequencyHz: 50, banks: [detunedBank(0.88)] }, 'en-GB');
    const tuning = markers.filter((m) => m.kind === 'tuning');
    expect(tuning.map((m) => m.steps)).toEqual(['steps 1–5', 'step 6']);
    // [COMMON] §4: 7 % at 50 Hz tunes to 189.0 Hz (order 3.78); 12 % lost → 189.0/√0.88 = 201.5 Hz (order 4.03).
    expect(tuning[0]!.order).toBeCloseTo(189 / 50, 2);
    expect(tuning[1]!.order).toBeCloseTo(201.5 / 50, 2);
    expect(tuning[1]).toMatchObject({ shifted: true, warning: false });
    expect(plain(tuning[1]!.description)).toBe('Bank A, step 6: tuned at 201 Hz (order 4.03), up 6.6 % from its design 189 Hz');
    expect(plain(tuning[0]!.description)).toContain('as designed');
    expect(markers.filter((m) => m.kind === 'design')).toHaveLength(1);
  });

  test('no design marker while every step still tunes as designed (no readings yet)', () => {
    const markers = harmonicAxisMarkers({ frequencyHz: 50, banks: [detunedBank(1)] });
    expect(markers.map((m) => m.kind)).toEqual(['tuning']);
    expect(markers[0]!.steps).toBe('steps 1–6');
  });
});

describe('orderX and lanes', () => {
  const scale = { width: 600, left: 20, right: 30 };

  test('orders run left to right from the 1st at the left margin; past the 15th sits at the right margin', () => {
    expect(orderX(1, scale)).toBe(20);
    expect(orderX(beyondOrder, scale)).toBe(570);
    expect(orderX(40, scale)).toBe(570);
    expect(orderX(5, scale)).toBeLessThan(orderX(7, scale));
    expect(orderX(axisLastOrder, scale)).toBeLessThan(orderX(beyondOrder, scale));
  });

  test('labels that would overlap go to separate lanes; those apart share the first', () => {
    expect(assignLanes([{ start: 0, end: 100 }, { start: 50, end: 150 }, { start: 200, end: 260 }, { start: 120, end: 190 }])).toEqual([0, 1, 0, 0]);
    expect(assignLanes([{ start: 0, end: 100 }, { start: 10, end: 20 }, { start: 30, end: 40 }])).toEqual([0, 1, 1]);
  });

  test('a label near the right edge turns to the left of its pin', () => {
    expect(labelExtent(100, 'Bank B 1–4', 600).anchor).toBe('start');
    const turned = labelExtent(580, 'Bank B 1–4', 600);
    expect(turned.anchor).toBe('end');
    expect(turned.end).toBeLessThanOrEqual(600);
  });
});

describe('harmonicAxisSummary', () => {
  test('names the marked harmonics and every marker in words', () => {
    const text = plain(harmonicAxisSummary(siteHealthFixture({ banks: [undetunedBank(), detunedBank(0.88)] }), 'en-GB'));
    expect(text).toContain('with the 5th, 7th, 11th and 13th marked');
    expect(text).toContain('order 12.91, within 1 % of the 13th (warning).');
    expect(text).toContain('Bank A, step 6: tuned at 201 Hz');
  });
});
