import { useQuery } from '@tanstack/react-query';
import { useId } from 'react';
import { PageHeader } from '../../components/page-header';
import { session } from '../../features/auth/api/session-queries';
import { ChangePasswordForm } from '../../features/auth/components/change-password-form';
import { roleList } from '../../features/auth/lib/role-labels';

/** The signed-in person's own page: who Varden knows them as, and their password. */
export default function AccountRoute() {
  const { data: me } = useQuery(session);
  const headingId = useId();
  if (!me) return null;
  return (
    <>
      <PageHeader title="Your account" lead="Your name and roles are set by an administrator; your password only by you." />
      <dl className="mb-8 grid max-w-measure gap-x-6 gap-y-2 desk:grid-cols-[8rem_1fr]">
        <dt className="text-ink-muted">Name</dt>
        <dd>{me.user.name}</dd>
        <dt className="text-ink-muted">E-mail</dt>
        <dd className="break-all">{me.user.email}</dd>
        <dt className="text-ink-muted">Roles</dt>
        <dd>{roleList(me.user.roles) || 'None yet: ask an administrator for the role you need.'}</dd>
      </dl>
      <section aria-labelledby={headingId} className="max-w-measure rounded-md border border-line bg-surface p-4 desk:p-6">
        <h2 id={headingId} className="mb-4 text-lg font-semibold">
          Change password
        </h2>
        <ChangePasswordForm />
      </section>
    </>
  );
}
