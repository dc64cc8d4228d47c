import { describe, expect, test } from 'vitest';
import { stepsText } from './step-labels';

describe('stepsText', () => {
  test('joins runs of steps in plain words', () => {
    expect(stepsText([2])).toBe('step 2');
    expect(stepsText([1, 2, 3, 4])).toBe('steps 1–4');
    expect(stepsText([1, 2])).toBe('steps 1 and 2');
    expect(stepsText([4, 1, 3])).toBe('steps 1, 3 and 4');
    expect(stepsText([1, 2, 3, 6, 8, 9, 10])).toBe('steps 1–3, 6 and 8–10');
  });
});
