import { useMutation } from '@tanstack/react-query';
import { passwordResetRequest } from '@varden/schemas';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router-dom';
import { Button } from '../../../components/button';
import { FormAlert, FormSuccess } from '../../../components/form/form-alert';
import { TextField } from '../../../components/form/text-field';
import { paths } from '../../../config/paths';
import { applyFieldErrors } from '../../../lib/form-errors';
import { zodResolver } from '../../../lib/schema-messages';
import { requestPasswordReset } from '../api/auth-requests';

/**
 * Asks for a link to set a new password. The answer is the same whether or not an account
 * uses the e-mail, so the form tells nobody who has an account.
 */
export function ResetPasswordForm() {
  const [formMessage, setFormMessage] = useState<string>();
  const form = useForm({ resolver: zodResolver(passwordResetRequest), defaultValues: { email: '' } });
  const mutation = useMutation({ mutationFn: requestPasswordReset, meta: { handlesErrors: true } });
  const { errors, isSubmitting } = form.formState;

  const onSubmit = form.handleSubmit(async (values) => {
    setFormMessage(undefined);
    try {
      await mutation.mutateAsync(values);
    } catch (error) {
      setFormMessage(applyFieldErrors(error, form.setError, ['email']));
    }
  });

  if (mutation.isSuccess) {
    return (
      <div className="grid gap-4">
        <FormSuccess>
          <p className="font-medium">{mutation.data.message}</p>
          <p className="mt-1 text-ink-muted">Nothing arrived? Check the address and your spam folder, or ask your administrator.</p>
        </FormSuccess>
        <p>
          <Link to={paths.signIn.getHref()}>Back to sign in</Link>
        </p>
      </div>
    );
  }

  return (
    <form noValidate onSubmit={(event) => void onSubmit(event)} className="grid gap-4">
      {formMessage && (
        <FormAlert>
          <p className="font-medium">{formMessage}</p>
        </FormAlert>
      )}
      <TextField
        label="E-mail"
        hint="The address you sign in with."
        type="email"
        autoComplete="username"
        inputMode="email"
        autoCapitalize="none"
        spellCheck={false}
        error={errors.email?.message}
        {...form.register('email')}
      />
      <Button type="submit" variant="primary" disabled={isSubmitting} className="w-full">
        {isSubmitting ? 'Sending…' : 'Send me a link'}
      </Button>
      <p className="text-base desk:text-sm">
        Remembered it? <Link to={paths.signIn.getHref()}>Sign in</Link>.
      </p>
    </form>
  );
}
