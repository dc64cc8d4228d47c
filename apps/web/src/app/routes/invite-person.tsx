import type { QueryClient } from '@tanstack/react-query';
import { Link, type LoaderFunctionArgs } from 'react-router-dom';
import { PageHeader } from '../../components/page-header';
import { paths } from '../../config/paths';
import { requirePermission } from '../../features/auth/lib/route-guards';
import { siteChoices } from '../../features/users/api/site-choices-queries';
import { InviteForm } from '../../features/users/components/invite-form';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    await requirePermission(queryClient, request, 'users:manage');
    void queryClient.prefetchQuery(siteChoices.list());
    return null;
  };

export default function InvitePersonRoute() {
  return (
    <>
      <PageHeader
        eyebrow="People"
        title="Invite someone"
        lead="Varden mails them a link to choose their own password. Until they do, they are listed as invited and cannot sign in."
      />
      <div className="max-w-measure rounded-md border border-line bg-surface p-4 desk:p-6">
        <InviteForm />
      </div>
      <p className="mt-6">
        <Link to={paths.people.getHref()}>Back to People</Link>
      </p>
    </>
  );
}
