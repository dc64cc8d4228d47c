import { useMutation, useQueryClient } from '@tanstack/react-query';
import { invitationCreate } from '@varden/schemas';
import { useState } from 'react';
import { Controller, useForm, useWatch } from 'react-hook-form';
import { useNavigate } from 'react-router-dom';
import { Button } from '../../../components/button';
import { FormAlert } from '../../../components/form/form-alert';
import { TextField } from '../../../components/form/text-field';
import { paths } from '../../../config/paths';
import { applyFieldErrors } from '../../../lib/form-errors';
import { zodResolver } from '../../../lib/schema-messages';
import type { LocationNotice } from '../../auth/lib/location-notice';
import { auditLog } from '../api/audit-log-queries';
import { users } from '../api/user-queries';
import { invitePerson } from '../api/user-requests';
import { RoleCheckboxes } from './role-checkboxes';
import { SiteGrantPicker } from './site-grant-picker';

/** Invites a person by e-mail with their roles (and a viewer's sites); they choose their own password from the mailed link. */
export function InviteForm() {
  const queryClient = useQueryClient();
  const navigate = useNavigate();
  const [formMessage, setFormMessage] = useState<string>();
  const form = useForm({
    resolver: zodResolver(invitationCreate),
    defaultValues: { email: '', name: '', roles: [], siteIds: [] },
  });
  const mutation = useMutation({ mutationFn: invitePerson, meta: { handlesErrors: true } });
  const { errors, isSubmitting } = form.formState;
  const isViewer = (useWatch({ control: form.control, name: 'roles' }) ?? []).includes('viewer');

  const onSubmit = form.handleSubmit(async (values) => {
    setFormMessage(undefined);
    try {
      const invited = await mutation.mutateAsync(values);
      void queryClient.invalidateQueries({ queryKey: users.lists() });
      void queryClient.invalidateQueries({ queryKey: auditLog.all });
      queryClient.setQueryData(users.detail(invited.id).queryKey, invited);
      const state: LocationNotice = {
        notice: `The invitation is on its way to ${invited.email}. The link in it works once, for 7 days.`,
      };
      await navigate(paths.person.getHref(invited.id), { state });
    } catch (error) {
      setFormMessage(applyFieldErrors(error, form.setError, ['email', 'name', 'roles', 'siteIds']));
    }
  });

  return (
    <form noValidate onSubmit={(event) => void onSubmit(event)} className="grid gap-5">
      {formMessage && (
        <FormAlert>
          <p className="font-medium">{formMessage}</p>
        </FormAlert>
      )}
      <div className="grid max-w-[28rem] gap-4">
        <TextField
          label="E-mail"
          type="email"
          inputMode="email"
          autoComplete="off"
          autoCapitalize="none"
          spellCheck={false}
          hint="The invitation goes here; it is also the address they sign in with."
          error={errors.email?.message}
          {...form.register('email')}
        />
        <TextField label="Name" autoComplete="off" hint="As colleagues know them: it appears on records they sign." error={errors.name?.message} {...form.register('name')} />
      </div>
      <Controller
        control={form.control}
        name="roles"
        render={({ field, fieldState }) => (
          <RoleCheckboxes
            value={field.value ?? []}
            onChange={(next) => {
              field.onChange(next);
              // Sites go to viewers only: unticking viewer drops the grants.
              if (!next.includes('viewer')) form.setValue('siteIds', []);
            }}
            onBlur={field.onBlur}
            error={fieldState.error?.message}
          />
        )}
      />
      {isViewer && (
        <Controller
          control={form.control}
          name="siteIds"
          render={({ field, fieldState }) => (
            <SiteGrantPicker value={field.value ?? []} onChange={field.onChange} onBlur={field.onBlur} error={fieldState.error?.message} />
          )}
        />
      )}
      <div>
        <Button type="submit" variant="primary" disabled={isSubmitting}>
          {isSubmitting ? 'Sending…' : 'Send the invitation'}
        </Button>
      </div>
    </form>
  );
}
