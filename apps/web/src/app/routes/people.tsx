import type { QueryClient } from '@tanstack/react-query';
import { useQuery } from '@tanstack/react-query';
import { Link, useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';
import { buttonClassName } from '../../components/button';
import { PageHeader } from '../../components/page-header';
import { paths } from '../../config/paths';
import { requirePermission } from '../../features/auth/lib/route-guards';
import { users } from '../../features/users/api/user-queries';
import { PeopleTable } from '../../features/users/components/people-table';
import { readPeopleSearch, writePeopleSearch, type PeopleSearch } from '../../features/users/lib/people-search';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requirePermission(queryClient, request, 'users:manage');
    await queryClient.ensureQueryData(users.list(readPeopleSearch(new URL(request.url).searchParams)));
    return null;
  };

/** The administrator's home: everyone who can use Varden, their roles and whether they may sign in. */
export default function PeopleRoute() {
  const [params, setParams] = useSearchParams();
  const search = readPeopleSearch(params);
  const list = useQuery(users.list(search));
  const onSearchChange = (next: PeopleSearch, options?: { replace?: boolean }) =>
    setParams(writePeopleSearch(next), { replace: options?.replace ?? false, preventScrollReset: true });

  return (
    <>
      <PageHeader
        title="People"
        lead="Everyone who can use Varden, what their roles let them do, and whether they may sign in."
        actions={
          <>
            <Link to={paths.invitePerson.getHref()} className={buttonClassName('primary')}>
              Invite someone
            </Link>
            <Link to={paths.auditLog.getHref()} className={buttonClassName('secondary')}>
              Audit log
            </Link>
          </>
        }
      />
      {list.isError && !list.data ? (
        <p role="alert">Could not load the people: {list.error.message}</p>
      ) : (
        <PeopleTable search={search} onSearchChange={onSearchChange} list={list.data} isFetching={list.isFetching} />
      )}
    </>
  );
}
