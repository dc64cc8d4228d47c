import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { User } from '@varden/schemas';
import { useId, useState } from 'react';
import { Button } from '../../../components/button';
import { FormAlert, FormSuccess } from '../../../components/form/form-alert';
import { formatDateTime } from '../../../lib/date-format';
import { auditLog } from '../api/audit-log-queries';
import { users } from '../api/user-queries';
import { invitePerson, updateUser } from '../api/user-requests';
import { AccountStatus } from './account-status';

type SignInAccessPanelProps = { person: User; isSelf: boolean };

function statusLine(person: User): string {
  switch (person.status) {
    case 'invited':
      return 'Has not chosen a password yet, so cannot sign in. An invitation link works for 7 days.';
    case 'active':
      return person.lastSignInAt ? `May sign in. Last signed in ${formatDateTime(person.lastSignInAt)}.` : 'May sign in. Has not signed in yet.';
    case 'deactivated':
      return 'May not sign in. Their records and their name in the audit log stay.';
  }
}

/** Whether the person may sign in: deactivate, reactivate, or send an invitation again. */
export function SignInAccessPanel({ person, isSelf }: SignInAccessPanelProps) {
  const queryClient = useQueryClient();
  const headingId = useId();
  const [confirming, setConfirming] = useState(false);
  const [done, setDone] = useState<string>();

  const afterChange = (saved: User, message: string) => {
    queryClient.setQueryData(users.detail(person.id).queryKey, saved);
    void queryClient.invalidateQueries({ queryKey: users.lists() });
    void queryClient.invalidateQueries({ queryKey: auditLog.all });
    setConfirming(false);
    setDone(message);
  };

  const setActive = useMutation({
    mutationFn: (active: boolean) => updateUser(person.id, { active }),
    meta: { handlesErrors: true },
    onMutate: () => setDone(undefined),
    onSuccess: (saved, active) =>
      afterChange(saved, active ? `${saved.name} may sign in again.` : `${saved.name} is deactivated and signed out everywhere.`),
  });
  const reinvite = useMutation({
    mutationFn: () => invitePerson({ email: person.email, name: person.name, roles: person.roles, siteIds: person.siteIds }),
    meta: { handlesErrors: true },
    onMutate: () => setDone(undefined),
    onSuccess: (saved) => afterChange(saved, `A new invitation is on its way to ${saved.email}. The earlier link no longer works.`),
  });
  const failure = setActive.error ?? reinvite.error;

  return (
    <section aria-labelledby={headingId} className="rounded-md border border-line bg-surface p-4 desk:p-6">
      <h2 id={headingId} className="text-lg font-semibold">
        Sign-in
      </h2>
      <p className="mt-2 flex flex-wrap items-center gap-x-2">
        <AccountStatus status={person.status} className="font-medium" />
        <span className="text-ink-muted">{statusLine(person)}</span>
      </p>
      {done && (
        <FormSuccess className="mt-3">
          <p className="font-medium">{done}</p>
        </FormSuccess>
      )}
      {failure && (
        <FormAlert className="mt-3">
          <p className="font-medium">{failure.message}</p>
        </FormAlert>
      )}
      <div className="mt-4 flex flex-wrap gap-2">
        {person.status === 'invited' && (
          <Button disabled={reinvite.isPending} onClick={() => reinvite.mutate()}>
            {reinvite.isPending ? 'Sending…' : 'Send a new invitation'}
          </Button>
        )}
        {person.status === 'deactivated' && (
          <Button disabled={setActive.isPending} onClick={() => setActive.mutate(true)}>
            Reactivate
          </Button>
        )}
        {person.status === 'active' && !confirming && (
          <Button onClick={() => setConfirming(true)}>Deactivate…</Button>
        )}
      </div>
      {person.status === 'active' && confirming && (
        <div role="group" aria-label="Confirm deactivation" className="mt-4 rounded border border-line-strong bg-sunken p-3">
          <p>
            {isSelf
              ? 'This is your own account: Varden will refuse, so that an organisation always keeps an administrator. Another administrator can deactivate you.'
              : `Deactivating signs ${person.name} out on every device and voids any link they were sent. You can reactivate the account later.`}
          </p>
          <div className="mt-3 flex flex-wrap gap-2">
            <Button variant="primary" disabled={setActive.isPending} onClick={() => setActive.mutate(false)}>
              {setActive.isPending ? 'Deactivating…' : `Deactivate ${person.name}`}
            </Button>
            <Button onClick={() => setConfirming(false)}>Keep active</Button>
          </div>
        </div>
      )}
    </section>
  );
}
