import { describe, expect, test } from 'vitest';
import { correctiveChecklistFor, correctiveDueDays, correctiveInstructionsFor, correctiveTitleFor } from './corrective-order';

describe('corrective orders from flags', () => {
  test('the title says what and where, from the start of the flag’s message', () => {
    expect(correctiveTitleFor('replace', 'Step 2, unit 1: 16.3 kvar at rated conditions, 34.6 % below nameplate.')).toBe('Replace a capacitor unit: Step 2, unit 1');
    expect(correctiveTitleFor('blown-fuse', 'Step 3, fuse 2 without continuity — a blown fuse usually means a failed capacitor.')).toBe(
      'Blown fuse: Step 3, fuse 2 without continuity',
    );
    // A decimal point is not the end of a sentence.
    expect(correctiveTitleFor('contactor-endurance', 'Step 2 contactor has used 85.2 % of its rated operations. Plan it.')).toBe(
      'Contactor near its endurance: Step 2 contactor has used 85.2 % of its rated operations',
    );
    expect(correctiveTitleFor('something-new', 'x'.repeat(400))).toHaveLength(200);
  });

  test('the checklist and the hint follow the kind; unknown kinds get a cautious default', () => {
    expect(correctiveChecklistFor('tuning-drift')).toEqual(['capacitance', 'reactor', 'visual']);
    expect(correctiveChecklistFor('something-new')).toEqual(['capacitance', 'visual']);
    expect(correctiveInstructionsFor('blown-fuse', 'Fuse open.')).toMatch(/^Fuse open\.\n\nA blown fuse usually means a failed capacitor/);
    expect(correctiveInstructionsFor('something-new', 'Look.')).toBe('Look.');
  });

  test('action flags are due in a week, advisory ones in a month', () => {
    expect(correctiveDueDays('action')).toBe(7);
    expect(correctiveDueDays('advisory')).toBe(30);
  });
});
