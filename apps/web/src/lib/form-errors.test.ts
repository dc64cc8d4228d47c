import { describe, expect, it } from 'vitest';
import { ApiError } from './api-client';
import { splitFieldErrors } from './form-errors';

describe('splitFieldErrors', () => {
  it("puts a 400's field messages on their fields and needs no message of its own", () => {
    const error = new ApiError(400, 'invalid', 'Some fields are not valid.', { email: 'Enter an e-mail address' });
    expect(splitFieldErrors(error, ['email', 'password'])).toEqual({ fields: [['email', 'Enter an e-mail address']], formMessage: undefined });
  });

  it('maps a nested path onto the field that holds it', () => {
    const error = new ApiError(400, 'invalid', 'Some fields are not valid.', { 'roles.0': 'Choose a role' });
    expect(splitFieldErrors(error, ['roles'])).toEqual({ fields: [['roles', 'Choose a role']], formMessage: undefined });
  });

  it('keeps the message above the form when a field message has no field here', () => {
    const error = new ApiError(400, 'invalid', 'The link is no longer valid.', { token: 'The link is no longer valid', password: 'Too short' });
    expect(splitFieldErrors(error, ['password'])).toEqual({ fields: [['password', 'Too short']], formMessage: 'The link is no longer valid.' });
  });

  it('keeps the message of a 409 above the form as well as on its field', () => {
    const error = new ApiError(409, 'conflict', 'You cannot remove your own administrator role.', { roles: 'Keep your administrator role' });
    expect(splitFieldErrors(error, ['roles'])).toEqual({
      fields: [['roles', 'Keep your administrator role']],
      formMessage: 'You cannot remove your own administrator role.',
    });
  });

  it('shows a wrong password, a throttle or no answer above the form', () => {
    expect(splitFieldErrors(new ApiError(401, 'unauthenticated', 'The e-mail or password is not right.'), ['email']).formMessage).toBe(
      'The e-mail or password is not right.',
    );
    expect(splitFieldErrors(new ApiError(429, 'throttled', 'Try again in 5 minutes.'), ['email']).formMessage).toBe('Try again in 5 minutes.');
    expect(splitFieldErrors(new TypeError('boom'), ['email'])).toEqual({ fields: [], formMessage: 'boom' });
  });
});
