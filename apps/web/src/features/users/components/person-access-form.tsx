import { useMutation, useQueryClient } from '@tanstack/react-query';
import { userUpdate, type User, type UserUpdate } from '@varden/schemas';
import { useState } from 'react';
import { Controller, useForm, useWatch } from 'react-hook-form';
import type { z } from 'zod';
import { Button } from '../../../components/button';
import { FormAlert, FormSuccess } from '../../../components/form/form-alert';
import { TextField } from '../../../components/form/text-field';
import { applyFieldErrors } from '../../../lib/form-errors';
import { zodResolver } from '../../../lib/schema-messages';
import { session } from '../../auth/api/session-queries';
import { auditLog } from '../api/audit-log-queries';
import { users } from '../api/user-queries';
import { updateUser } from '../api/user-requests';
import { RoleCheckboxes } from './role-checkboxes';
import { SiteGrantPicker } from './site-grant-picker';

type PersonAccessFormProps = { person: User; isSelf: boolean };

const valuesOf = (person: User) => ({ name: person.name, roles: person.roles, siteIds: person.siteIds });

/** Name, roles and a viewer's sites, saved together; only what changed is sent. */
export function PersonAccessForm({ person, isSelf }: PersonAccessFormProps) {
  const queryClient = useQueryClient();
  const [formMessage, setFormMessage] = useState<string>();
  const form = useForm<UserUpdate, unknown, z.output<typeof userUpdate>>({ resolver: zodResolver(userUpdate), defaultValues: valuesOf(person) });
  const mutation = useMutation({ mutationFn: (patch: UserUpdate) => updateUser(person.id, patch), meta: { handlesErrors: true } });
  const { errors, isSubmitting, isDirty } = form.formState;
  const chosenRoles = useWatch({ control: form.control, name: 'roles' }) ?? [];
  const isViewer = chosenRoles.includes('viewer');

  const onSubmit = form.handleSubmit(async (values) => {
    setFormMessage(undefined);
    mutation.reset();
    const patch: UserUpdate = {};
    if (form.getFieldState('name').isDirty) patch.name = values.name;
    if (form.getFieldState('roles').isDirty) patch.roles = values.roles;
    // Sites go to viewers only; the server drops a former viewer's grants by itself.
    if (form.getFieldState('siteIds').isDirty && isViewer) patch.siteIds = values.siteIds;
    if (Object.keys(patch).length === 0) return;
    try {
      const saved = await mutation.mutateAsync(patch);
      queryClient.setQueryData(users.detail(person.id).queryKey, saved);
      form.reset(valuesOf(saved));
      void queryClient.invalidateQueries({ queryKey: users.lists() });
      void queryClient.invalidateQueries({ queryKey: auditLog.all });
      if (isSelf) void queryClient.invalidateQueries({ queryKey: session.queryKey });
    } catch (error) {
      setFormMessage(applyFieldErrors(error, form.setError, ['name', 'roles', 'siteIds']));
    }
  });

  return (
    <form noValidate onSubmit={(event) => void onSubmit(event)} className="grid gap-5">
      {mutation.isSuccess && !isDirty && (
        <FormSuccess>
          <p className="font-medium">Saved. The change is in the audit log.</p>
        </FormSuccess>
      )}
      {formMessage && (
        <FormAlert>
          <p className="font-medium">{formMessage}</p>
        </FormAlert>
      )}
      <div className="max-w-[28rem]">
        <TextField label="Name" autoComplete="off" error={errors.name?.message} {...form.register('name')} />
      </div>
      <Controller
        control={form.control}
        name="roles"
        render={({ field, fieldState }) => (
          <RoleCheckboxes
            value={field.value ?? []}
            onChange={field.onChange}
            onBlur={field.onBlur}
            error={fieldState.error?.message}
            {...(isSelf ? { hint: 'This is you. Another administrator has to remove your own administrator role.' } : {})}
          />
        )}
      />
      {isViewer ? (
        <Controller
          control={form.control}
          name="siteIds"
          render={({ field, fieldState }) => (
            <SiteGrantPicker value={field.value ?? []} onChange={field.onChange} onBlur={field.onBlur} error={fieldState.error?.message} />
          )}
        />
      ) : (
        <p className="text-base text-ink-muted desk:text-sm">
          Sites are granted to viewers only. Every other role works across all sites.
        </p>
      )}
      <div className="flex flex-wrap gap-2">
        <Button type="submit" variant="primary" disabled={isSubmitting || !isDirty}>
          {isSubmitting ? 'Saving…' : 'Save changes'}
        </Button>
        {isDirty && (
          <Button
            onClick={() => {
              form.reset(valuesOf(person));
              setFormMessage(undefined);
            }}
          >
            Undo changes
          </Button>
        )}
      </div>
    </form>
  );
}
