import {
  messageResponse,
  sessionResponse,
  setPasswordResponse,
  type ChangePasswordRequest,
  type MessageResponse,
  type PasswordResetRequest,
  type SessionResponse,
  type SetPasswordRequest,
  type SetPasswordResponse,
  type SignInRequest,
} from '@varden/schemas';
import { apiRequest, isApiError } from '../../../lib/api-client';

// The requests of signing in and out and of setting passwords, each typed by its shared contract.

const noBody = () => undefined;

/** POST /api/auth/sign-in. 401 for a wrong e-mail or password (one message for both), 429 when throttled. */
export function signIn(body: SignInRequest): Promise<SessionResponse> {
  return apiRequest('/api/auth/sign-in', { method: 'POST', body, parse: (json) => sessionResponse.parse(json) });
}

/** POST /api/auth/sign-out. A session that had already ended counts as signed out. */
export async function signOut(): Promise<void> {
  try {
    await apiRequest('/api/auth/sign-out', { method: 'POST', parse: noBody });
  } catch (error) {
    if (isApiError(error) && error.status === 401) return;
    throw error;
  }
}

/** POST /api/auth/password-resets. Answers the same whether or not the e-mail has an account. */
export function requestPasswordReset(body: PasswordResetRequest): Promise<MessageResponse> {
  return apiRequest('/api/auth/password-resets', { method: 'POST', body, parse: (json) => messageResponse.parse(json) });
}

/** POST /api/auth/set-password, with the token from an invitation or reset link. */
export function setPassword(body: SetPasswordRequest): Promise<SetPasswordResponse> {
  return apiRequest('/api/auth/set-password', { method: 'POST', body, parse: (json) => setPasswordResponse.parse(json) });
}

/** POST /api/auth/change-password. Ends every other session; this browser gets a new one. */
export async function changePassword(body: ChangePasswordRequest): Promise<void> {
  await apiRequest('/api/auth/change-password', { method: 'POST', body, parse: noBody });
}
