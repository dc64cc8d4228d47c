import { describe, expect, test } from 'vitest';
import { tuningDomain, tuningRows } from './tuning-rows';
import { detunedBank, undetunedBank } from './site-health-fixture';

describe('tuningRows', () => {
  test('one row per detuned step, with its standing; undetuned banks have none', () => {
    const health = { frequencyHz: 50, banks: [undetunedBank(), detunedBank(0.88)] };
    const rows = tuningRows(health);
    expect(rows).toHaveLength(6);
    expect(rows[5]).toMatchObject({ label: 'Bank A · step 6', standing: 'shifted', fifthHarmonicHz: 250 });
    expect(rows[0]!.standing).toBe('as-designed');
    // [COMMON] §4: 189.0 Hz design, 201.5 Hz at 12 % loss; the range runs from under 189 to over 250.
    expect(tuningDomain(rows, health)).toEqual([170, 260]);
  });

  test('a 14 % bank keeps the 3rd (150 Hz) in view', () => {
    const bank = { ...detunedBank(), detuningFactor: 0.14 };
    const health = { frequencyHz: 50, banks: [bank] };
    const [low] = tuningDomain(tuningRows(health), health);
    expect(low).toBeLessThanOrEqual(150);
  });
});
