import { user, type InvitationCreate, type User, type UserUpdate } from '@varden/schemas';
import { apiRequest } from '../../../lib/api-client';

/** PATCH /api/users/:id. 409 when an administrator would lock themselves out. */
export function updateUser(id: number, body: UserUpdate): Promise<User> {
  return apiRequest(`/api/users/${id}`, { method: 'PATCH', body, parse: (json) => user.parse(json) });
}

/** POST /api/auth/invitations: creates the person (invited) and mails them a link to choose a password. */
export function invitePerson(body: InvitationCreate): Promise<User> {
  return apiRequest('/api/auth/invitations', { method: 'POST', body, parse: (json) => user.parse(json) });
}
