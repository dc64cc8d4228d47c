import { describe, expect, it } from 'vitest';
import { characterCount } from './character-count';
import { noticeFrom } from './location-notice';
import { roleList } from './role-labels';

describe('characterCount', () => {
  it('counts as the password policy does, in code points', () => {
    expect(characterCount('')).toBe('At least 12 characters.');
    expect(characterCount('copper')).toBe('6 characters: 6 more to go.');
    // Four emoji are four characters, though eight UTF-16 units.
    expect(characterCount('⚡⚡⚡⚡ busbar')).toBe('11 characters: 1 more to go.');
    expect(characterCount('copper busbar')).toBe('13 characters.');
  });
});

describe('noticeFrom', () => {
  it('reads a notice handed over in router state, and ignores anything else', () => {
    expect(noticeFrom({ notice: 'You are signed out.' })).toEqual({ notice: 'You are signed out.' });
    expect(noticeFrom({ notice: 'Set.', email: 'a@example.test' })).toEqual({ notice: 'Set.', email: 'a@example.test' });
    expect(noticeFrom(null)).toBeUndefined();
    expect(noticeFrom({ notice: 3 })).toBeUndefined();
    expect(noticeFrom('notice')).toBeUndefined();
  });
});

describe('roleList', () => {
  it('names the roles in the order given', () => {
    expect(roleList(['planner', 'admin'])).toBe('Planner, Administrator');
    expect(roleList([])).toBe('');
  });
});
