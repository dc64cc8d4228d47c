import type { Permission } from '@varden/schemas';
import { describe, expect, test } from 'vitest';
import { allowedMoves, editRights, type Actor } from './allowed-moves';

const planner: Actor = { userId: 1, permissions: ['work-orders:read', 'work-orders:schedule', 'plans:manage'] };
const technician: Actor = { userId: 2, permissions: ['work-orders:read', 'work-orders:perform'] };
const supervisor: Actor = { userId: 3, permissions: ['work-orders:read', 'work-orders:review'] };
const viewer: Actor = { userId: 4, permissions: ['work-orders:read'] as Permission[] };

const order = (state: Parameters<typeof allowedMoves>[0]['state'], assigneeId: number | null = 2, locked = false) => ({ state, assigneeId, locked });
const targets = (moves: ReturnType<typeof allowedMoves>) => moves.map((m) => m.to).sort();

describe('allowedMoves', () => {
  test('a planner dispatches or withdraws a queued order', () => {
    expect(targets(allowedMoves(order('queued', null), planner))).toEqual(['dispatched', 'withdrawn']);
    expect(allowedMoves(order('queued'), planner).every((m) => m.mover === 'planner')).toBe(true);
  });

  test('a planner recalls or withdraws a dispatched order; its technician starts it on site', () => {
    expect(targets(allowedMoves(order('dispatched'), planner))).toEqual(['queued', 'withdrawn']);
    expect(targets(allowedMoves(order('dispatched'), technician))).toEqual(['on-site']);
  });

  test('only the assigned technician makes the assignee’s moves', () => {
    const otherTechnician: Actor = { ...technician, userId: 9 };
    expect(allowedMoves(order('on-site'), otherTechnician)).toEqual([]);
    expect(targets(allowedMoves(order('on-site'), technician))).toEqual(['awaiting-review']);
    expect(targets(allowedMoves(order('sent-back'), technician))).toEqual(['on-site']);
  });

  test('a supervisor seals or sends back a submitted order, but not one they performed', () => {
    expect(targets(allowedMoves(order('awaiting-review'), supervisor))).toEqual(['sealed', 'sent-back']);
    expect(allowedMoves(order('awaiting-review', supervisor.userId), supervisor)).toEqual([]);
    expect(allowedMoves(order('awaiting-review'), planner)).toEqual([]);
  });

  test('a sealed or withdrawn order, a viewer and nobody signed in make no move', () => {
    expect(allowedMoves(order('sealed', 2, true), supervisor)).toEqual([]);
    expect(allowedMoves(order('withdrawn'), planner)).toEqual([]);
    expect(allowedMoves(order('queued'), viewer)).toEqual([]);
    expect(allowedMoves(order('queued'), null)).toEqual([]);
  });

  test('a locked order makes no move even in a state that has some', () => {
    expect(allowedMoves(order('awaiting-review', 2, true), supervisor)).toEqual([]);
  });
});

describe('editRights', () => {
  test('a planner reschedules any open order and reassigns it before and after the field work', () => {
    expect(editRights(order('queued'), planner)).toEqual({ reschedule: true, reassign: true });
    expect(editRights(order('dispatched'), planner)).toEqual({ reschedule: true, reassign: true });
    expect(editRights(order('sent-back'), planner)).toEqual({ reschedule: true, reassign: true });
    expect(editRights(order('on-site'), planner)).toEqual({ reschedule: true, reassign: false });
    expect(editRights(order('awaiting-review'), planner)).toEqual({ reschedule: true, reassign: false });
  });

  test('nothing changes once sealed or withdrawn, nor for anyone but a planner', () => {
    expect(editRights(order('sealed', 2, true), planner)).toEqual({ reschedule: false, reassign: false });
    expect(editRights(order('withdrawn'), planner)).toEqual({ reschedule: false, reassign: false });
    expect(editRights(order('queued'), supervisor)).toEqual({ reschedule: false, reassign: false });
  });
});
