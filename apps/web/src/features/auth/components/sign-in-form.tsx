import { useMutation, useQueryClient } from '@tanstack/react-query';
import { signInRequest } from '@varden/schemas';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Link, useNavigate } from 'react-router-dom';
import { Button } from '../../../components/button';
import { FormAlert } from '../../../components/form/form-alert';
import { PasswordField } from '../../../components/form/password-field';
import { TextField } from '../../../components/form/text-field';
import { paths } from '../../../config/paths';
import { applyFieldErrors } from '../../../lib/form-errors';
import { zodResolver } from '../../../lib/schema-messages';
import { signIn } from '../api/auth-requests';
import { destinationAfterSignIn } from '../lib/route-guards';
import { replaceSession } from '../lib/session-cache';

type SignInFormProps = {
  /** Where to go afterwards (from ?next=); the role's home when absent or unsafe. */
  next: string | null;
  initialEmail?: string | undefined;
};

export function SignInForm({ next, initialEmail }: SignInFormProps) {
  const queryClient = useQueryClient();
  const navigate = useNavigate();
  const [formMessage, setFormMessage] = useState<string>();
  const form = useForm({
    resolver: zodResolver(signInRequest),
    defaultValues: { email: initialEmail ?? '', password: '' },
  });
  const mutation = useMutation({ mutationFn: signIn, meta: { handlesErrors: true } });
  const { errors, isSubmitting } = form.formState;

  const onSubmit = form.handleSubmit(async (values) => {
    setFormMessage(undefined);
    try {
      const me = await mutation.mutateAsync(values);
      replaceSession(queryClient, me);
      await navigate(destinationAfterSignIn(me, next), { replace: true });
    } catch (error) {
      setFormMessage(applyFieldErrors(error, form.setError, ['email', 'password']));
      form.resetField('password', { keepError: true });
    }
  });

  return (
    <form noValidate onSubmit={(event) => void onSubmit(event)} className="grid gap-4">
      {formMessage && (
        <FormAlert>
          <p className="font-medium">{formMessage}</p>
        </FormAlert>
      )}
      <TextField
        label="E-mail"
        type="email"
        autoComplete="username"
        inputMode="email"
        autoCapitalize="none"
        spellCheck={false}
        error={errors.email?.message}
        {...form.register('email')}
      />
      <PasswordField label="Password" autoComplete="current-password" error={errors.password?.message} {...form.register('password')} />
      <Button type="submit" variant="primary" disabled={isSubmitting} className="w-full">
        {isSubmitting ? 'Signing in…' : 'Sign in'}
      </Button>
      <p className="text-base desk:text-sm">
        Forgotten your password, or never set one? <Link to={paths.resetPassword.getHref()}>Get a link to set a new one</Link>.
      </p>
    </form>
  );
}
