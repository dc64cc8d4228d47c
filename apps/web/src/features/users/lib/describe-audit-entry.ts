import { roles, type AuditEntry, type Role } from '@varden/schemas';
import { roleLabels } from '../../auth/lib/role-labels';

export type AuditDescription = {
  /** The change in a few words: "Invited", "Changed access". */
  what: string;
  /** One line per part of the change: "Roles: Planner → Planner, Administrator". */
  lines: string[];
};

/** A site's name by id, when the sites are known; the id is shown otherwise. */
export type SiteNamer = (id: number) => string | undefined;

const isRecord = (value: unknown): value is Record<string, unknown> =>
  typeof value === 'object' && value !== null && !Array.isArray(value);

const isRole = (value: unknown): value is Role => typeof value === 'string' && (roles as readonly string[]).includes(value);

function roleText(value: unknown): string {
  if (!Array.isArray(value) || value.length === 0) return 'none';
  return value.map((role) => (isRole(role) ? roleLabels[role] : String(role))).join(', ');
}

function sitesText(value: unknown, siteName: SiteNamer): string {
  if (!Array.isArray(value) || value.length === 0) return 'none';
  return value.map((id) => (typeof id === 'number' ? (siteName(id) ?? `site ${id}`) : String(id))).join(', ');
}

function plain(value: unknown): string {
  if (typeof value === 'string') return value;
  if (value === null || value === undefined) return '—';
  return JSON.stringify(value);
}

function invitationLines(details: Record<string, unknown>, siteName: SiteNamer): string[] {
  const lines = [`${plain(details.name)} <${plain(details.email)}>`, `Roles: ${roleText(details.roles)}`];
  if (Array.isArray(details.siteIds) && details.siteIds.length > 0) lines.push(`Sites: ${sitesText(details.siteIds, siteName)}`);
  return lines;
}

const signInState = (active: unknown) => (active === true ? 'may sign in' : 'deactivated');

function changeLines(details: Record<string, unknown>, siteName: SiteNamer): string[] {
  const changes = isRecord(details.changes) ? details.changes : {};
  const lines: string[] = [];
  for (const [field, change] of Object.entries(changes)) {
    if (!isRecord(change)) continue;
    const { from, to } = change;
    if (field === 'name') lines.push(`Name: ${plain(from)} → ${plain(to)}`);
    else if (field === 'roles') lines.push(`Roles: ${roleText(from)} → ${roleText(to)}`);
    else if (field === 'siteIds') lines.push(`Sites: ${sitesText(from, siteName)} → ${sitesText(to, siteName)}`);
    else if (field === 'active') lines.push(`Sign-in: ${signInState(from)} → ${signInState(to)}`);
    else lines.push(`${field}: ${plain(from)} → ${plain(to)}`);
  }
  return lines;
}

/** An audit-log entry in words. Actions this version does not know keep their code and raw details. */
export function describeAuditEntry(entry: AuditEntry, siteName: SiteNamer = () => undefined): AuditDescription {
  const { details } = entry;
  switch (entry.action) {
    case 'user.invited':
      return { what: 'Invited', lines: invitationLines(details, siteName) };
    case 'user.re-invited':
      return { what: 'Invited again', lines: invitationLines(details, siteName) };
    case 'user.updated':
      return { what: 'Changed access', lines: changeLines(details, siteName) };
    case 'user.invitation-accepted':
      return { what: 'Accepted the invitation', lines: ['Chose a password; the account can sign in'] };
    case 'user.password-reset':
      return { what: 'Set a new password', lines: ['From a reset link; every session ended'] };
    case 'user.password-changed':
      return { what: 'Changed their password', lines: ['Every other session ended'] };
    default:
      return { what: entry.action, lines: Object.entries(details).map(([key, value]) => `${key}: ${plain(value)}`) };
  }
}
