import { describe, expect, test } from 'vitest';
import fc from 'fast-check';
import { accountLockedUntil, addressLockedUntil, retryAfterSeconds, throttledMessage } from './sign-in-throttle';
import type { PastAttempt } from './sign-in-attempts.repository';

const t0 = Date.parse('2026-03-02T08:00:00Z');
const at = (minutes: number) => new Date(t0 + minutes * 60_000);
/** Attempts given oldest first, returned newest first as the repository does. */
const history = (...items: Array<[PastAttempt['outcome'], number]>): PastAttempt[] =>
  items.map(([outcome, minutes]) => ({ outcome, at: at(minutes) })).reverse();
const fails = (...minutes: number[]) => minutes.map((m) => ['failed', m] as [PastAttempt['outcome'], number]);

describe('accountLockedUntil', () => {
  test('four failures leave the account open', () => {
    expect(accountLockedUntil(history(...fails(0, 1, 2, 3)), at(3))).toBeUndefined();
  });

  test('five failures within 15 minutes lock it for 5 minutes after the last', () => {
    const attempts = history(...fails(0, 1, 2, 3, 4));
    expect(accountLockedUntil(attempts, at(4))).toEqual(at(9));
    expect(accountLockedUntil(attempts, at(9))).toBeUndefined();
  });

  test('five failures spread over more than 15 minutes do not lock', () => {
    expect(accountLockedUntil(history(...fails(0, 5, 10, 15, 20)), at(20))).toBeUndefined();
  });

  test('each failure after a lock doubles it, up to an hour', () => {
    expect(accountLockedUntil(history(...fails(0, 1, 2, 3, 4, 10)), at(10))).toEqual(at(20));
    expect(accountLockedUntil(history(...fails(0, 1, 2, 3, 4, 10, 21)), at(21))).toEqual(at(41));
    expect(accountLockedUntil(history(...fails(0, 1, 2, 3, 4, 10, 21, 42, 83, 150)), at(150))).toEqual(at(210));
  });

  test('a success forgets earlier failures; throttled attempts do not count', () => {
    expect(accountLockedUntil(history(...fails(0, 1, 2, 3), ['succeeded', 4], ['failed', 5]), at(5))).toBeUndefined();
    expect(accountLockedUntil(history(...fails(0, 1, 2, 3), ['throttled', 3.5], ['throttled', 3.6]), at(4))).toBeUndefined();
  });

  test('unsettled attempts count as failures, so parallel guesses cannot slip through', () => {
    expect(accountLockedUntil(history(...fails(0, 0, 0), ['pending', 0], ['pending', 0]), at(0))).toEqual(at(5));
  });

  test('never locks below five failures, whatever their timing', () => {
    fc.assert(
      fc.property(fc.array(fc.integer({ min: 0, max: 1000 }), { maxLength: 4 }), (minutes) => {
        const sorted = [...minutes].sort((a, b) => a - b);
        expect(accountLockedUntil(history(...fails(...sorted)), at(sorted.at(-1) ?? 0))).toBeUndefined();
      }),
    );
  });
});

describe('addressLockedUntil', () => {
  const failures = (count: number) => Array.from({ length: count }, (_, i) => at(i * 0.5)).reverse();

  test('holds an address after 20 failures until the oldest counted is 15 minutes old', () => {
    expect(addressLockedUntil(failures(19), at(10))).toBeUndefined();
    expect(addressLockedUntil(failures(20), at(10))).toEqual(at(15));
    expect(addressLockedUntil(failures(20), at(15))).toBeUndefined();
  });
});

describe('the message', () => {
  test('says when to try again, in whole minutes', () => {
    expect(throttledMessage(retryAfterSeconds(at(4), at(0)))).toBe('Too many failed sign-ins. Try again in 4 minutes.');
    expect(throttledMessage(30)).toBe('Too many failed sign-ins. Try again in 1 minute.');
    expect(throttledMessage(61)).toBe('Too many failed sign-ins. Try again in 2 minutes.');
  });
});
