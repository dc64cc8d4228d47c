import type { Role } from '@varden/schemas';

export const roleLabels: Readonly<Record<Role, string>> = {
  admin: 'Administrator',
  planner: 'Planner',
  technician: 'Technician',
  supervisor: 'Supervisor',
  viewer: 'Viewer',
};

/** What each role gets done in Varden, shown beside its checkbox. */
export const roleDescriptions: Readonly<Record<Role, string>> = {
  admin: 'Manages people, their roles and the organisation’s settings.',
  planner: 'Keeps the register, plans inspections and schedules work orders.',
  technician: 'Carries out work orders and records readings in the switch-room.',
  supervisor: 'Reviews submitted work orders and signs them off or returns them.',
  viewer: 'Reads the health and signed records of the sites granted to them.',
};

/** "Planner, Administrator" in the order the roles are given. */
export function roleList(roles: readonly Role[]): string {
  return roles.map((role) => roleLabels[role]).join(', ');
}
