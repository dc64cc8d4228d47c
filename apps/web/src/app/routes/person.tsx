import type { QueryClient } from '@tanstack/react-query';
import { useQuery } from '@tanstack/react-query';
import { userIdParams } from '@varden/schemas';
import { useId } from 'react';
import { data, Link, useLocation, useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { FormSuccess } from '../../components/form/form-alert';
import { PageHeader } from '../../components/page-header';
import { paths } from '../../config/paths';
import { session } from '../../features/auth/api/session-queries';
import { noticeFrom } from '../../features/auth/lib/location-notice';
import { requirePermission } from '../../features/auth/lib/route-guards';
import { siteChoices } from '../../features/users/api/site-choices-queries';
import { users } from '../../features/users/api/user-queries';
import { PersonAccessForm } from '../../features/users/components/person-access-form';
import { SignInAccessPanel } from '../../features/users/components/sign-in-access-panel';

function personId(params: Readonly<Record<string, string | undefined>>): number {
  const parsed = userIdParams.safeParse(params);
  if (!parsed.success) throw data({ message: 'A person’s address ends in their number, such as /people/12.' }, { status: 404 });
  return parsed.data.id;
}

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request, params }: LoaderFunctionArgs) => {
    await requirePermission(queryClient, request, 'users:manage');
    const id = personId(params);
    void queryClient.prefetchQuery(siteChoices.list());
    await queryClient.ensureQueryData(users.detail(id));
    return null;
  };

/** One person: their roles, a viewer's sites, and whether they may sign in. */
export default function PersonRoute() {
  const id = personId(useParams());
  const { data: person } = useQuery(users.detail(id));
  const { data: me } = useQuery(session);
  const location = useLocation();
  const notice = noticeFrom(location.state);
  const accessHeading = useId();
  // The loader has fetched the person; only a cache cleared meanwhile (signing out) leaves none.
  if (!person) return null;
  const isSelf = me?.user.id === person.id;

  return (
    <>
      <PageHeader
        eyebrow="People"
        title={person.name}
        lead={<span className="break-all">{person.email}</span>}
        actions={
          <Link to={paths.auditLog.getHref(new URLSearchParams({ targetType: 'user', targetId: String(person.id) }))}>
            Changes in the audit log
          </Link>
        }
      />
      {notice && (
        <FormSuccess className="mb-6 max-w-measure">
          <p className="font-medium">{notice.notice}</p>
        </FormSuccess>
      )}
      <div className="grid gap-6 desk:grid-cols-[minmax(0,3fr)_minmax(0,2fr)] desk:items-start">
        <section aria-labelledby={accessHeading} className="rounded-md border border-line bg-surface p-4 desk:p-6">
          <h2 id={accessHeading} className="mb-4 text-lg font-semibold">
            Roles and sites
          </h2>
          <PersonAccessForm key={person.id} person={person} isSelf={isSelf} />
        </section>
        <SignInAccessPanel person={person} isSelf={isSelf} />
      </div>
      <p className="mt-6">
        <Link to={paths.people.getHref()}>Back to People</Link>
      </p>
    </>
  );
}
