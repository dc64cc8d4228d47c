import { useMutation } from '@tanstack/react-query';
import { changePasswordRequest } from '@varden/schemas';
import { useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import * as z from 'zod/mini';
import { Button } from '../../../components/button';
import { FormAlert, FormSuccess } from '../../../components/form/form-alert';
import { PasswordField } from '../../../components/form/password-field';
import { applyFieldErrors } from '../../../lib/form-errors';
import { zodResolver } from '../../../lib/schema-messages';
import { changePassword } from '../api/auth-requests';
import { characterCount } from '../lib/character-count';
import { PasswordPolicy } from './password-policy';

/** The shared change-password contract plus the new password typed a second time. */
const changePasswordForm = z
  .extend(changePasswordRequest, { repeat: z.string() })
  .check(z.refine((values) => values.newPassword === values.repeat, { path: ['repeat'], error: 'The two new passwords are not the same' }));

const empty = { currentPassword: '', newPassword: '', repeat: '' };

export function ChangePasswordForm() {
  const [formMessage, setFormMessage] = useState<string>();
  const form = useForm({ resolver: zodResolver(changePasswordForm), defaultValues: empty });
  const mutation = useMutation({ mutationFn: changePassword, meta: { handlesErrors: true } });
  const { errors, isSubmitting } = form.formState;
  const chosen = useWatch({ control: form.control, name: 'newPassword' });

  const onSubmit = form.handleSubmit(async ({ currentPassword, newPassword }) => {
    setFormMessage(undefined);
    try {
      await mutation.mutateAsync({ currentPassword, newPassword });
      form.reset(empty);
    } catch (error) {
      mutation.reset();
      setFormMessage(applyFieldErrors(error, form.setError, ['currentPassword', 'newPassword']));
    }
  });

  return (
    <form noValidate onSubmit={(event) => void onSubmit(event)} className="grid max-w-[28rem] gap-4">
      {mutation.isSuccess && (
        <FormSuccess>
          <p className="font-medium">Password changed.</p>
          <p className="mt-1 text-ink-muted">Every other device you were signed in on has been signed out; this one stays signed in.</p>
        </FormSuccess>
      )}
      {formMessage && (
        <FormAlert>
          <p className="font-medium">{formMessage}</p>
        </FormAlert>
      )}
      <PasswordField
        label="Current password"
        autoComplete="current-password"
        error={errors.currentPassword?.message}
        {...form.register('currentPassword')}
      />
      <PasswordPolicy />
      <PasswordField
        label="New password"
        autoComplete="new-password"
        hint={characterCount(chosen)}
        error={errors.newPassword?.message}
        {...form.register('newPassword')}
      />
      <PasswordField label="The new password again" autoComplete="new-password" error={errors.repeat?.message} {...form.register('repeat')} />
      <div>
        <Button type="submit" variant="primary" disabled={isSubmitting}>
          {isSubmitting ? 'Changing…' : 'Change password'}
        </Button>
      </div>
    </form>
  );
}
