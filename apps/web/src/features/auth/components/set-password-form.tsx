import { useMutation, useQueryClient } from '@tanstack/react-query';
import { newPassword, type TokenPurpose } from '@varden/schemas';
import { useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { Link, useNavigate } from 'react-router-dom';
import * as z from 'zod/mini';
import { Button } from '../../../components/button';
import { FormAlert } from '../../../components/form/form-alert';
import { PasswordField } from '../../../components/form/password-field';
import { paths } from '../../../config/paths';
import { isApiError } from '../../../lib/api-client';
import { applyFieldErrors } from '../../../lib/form-errors';
import { zodResolver } from '../../../lib/schema-messages';
import { setPassword } from '../api/auth-requests';
import { session } from '../api/session-queries';
import { characterCount } from '../lib/character-count';
import type { LocationNotice } from '../lib/location-notice';
import { PasswordPolicy } from './password-policy';

/** The shared password rule, typed twice. The token comes from the link, not the form. */
const setPasswordForm = z
  .object({ password: newPassword, repeat: z.string() })
  .check(z.refine((values) => values.password === values.repeat, { path: ['repeat'], error: 'The two passwords are not the same' }));

type SetPasswordFormProps = { token: string; purpose: TokenPurpose };

export function SetPasswordForm({ token, purpose }: SetPasswordFormProps) {
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  const [formMessage, setFormMessage] = useState<string>();
  const [linkSpent, setLinkSpent] = useState(false);
  const form = useForm({ resolver: zodResolver(setPasswordForm), defaultValues: { password: '', repeat: '' } });
  const mutation = useMutation({ mutationFn: setPassword, meta: { handlesErrors: true } });
  const { errors, isSubmitting } = form.formState;
  const password = useWatch({ control: form.control, name: 'password' });

  const onSubmit = form.handleSubmit(async ({ password: chosen }) => {
    setFormMessage(undefined);
    try {
      const result = await mutation.mutateAsync({ token, password: chosen });
      const state: LocationNotice = {
        notice:
          result.purpose === 'invitation'
            ? 'Your password is set and your account is ready. Sign in with it now.'
            : 'Your new password is set. Every device that was signed in has been signed out; sign in with the new password.',
        email: result.email,
      };
      // Setting a password ends the account's sessions: ask afresh who this browser is signed in as.
      await queryClient.fetchQuery({ ...session, staleTime: 0 });
      await navigate(paths.signIn.getHref(), { replace: true, state });
    } catch (error) {
      // A spent or expired link cannot be mended by typing: say so and offer the way on.
      if (isApiError(error) && 'token' in error.fields) setLinkSpent(true);
      setFormMessage(applyFieldErrors(error, form.setError, ['password']));
    }
  });

  return (
    <form noValidate onSubmit={(event) => void onSubmit(event)} className="grid gap-4">
      {formMessage && (
        <FormAlert>
          <p className="font-medium">{formMessage}</p>
          {linkSpent && purpose === 'reset' && (
            <p className="mt-1">
              <Link to={paths.resetPassword.getHref()}>Get a new link</Link>
            </p>
          )}
        </FormAlert>
      )}
      <PasswordPolicy />
      <PasswordField
        label="New password"
        autoComplete="new-password"
        hint={characterCount(password)}
        error={errors.password?.message}
        {...form.register('password')}
      />
      <PasswordField label="The same password again" autoComplete="new-password" error={errors.repeat?.message} {...form.register('repeat')} />
      <Button type="submit" variant="primary" disabled={isSubmitting || linkSpent} className="w-full">
        {isSubmitting ? 'Saving…' : purpose === 'invitation' ? 'Set my password' : 'Set the new password'}
      </Button>
    </form>
  );
}
