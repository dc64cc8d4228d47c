import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import { PageHeader } from '../../components/page-header';
import { paths } from '../../config/paths';
import { session } from '../../features/auth/api/session-queries';

/** Open to everyone: a mistyped address says so, signed in or not. */
export default function NotFoundRoute() {
  const { data: me } = useQuery(session);
  return (
    <>
      <PageHeader title="Nothing here" lead="This address does not lead to a page in Varden. It may have been mistyped or moved." />
      {me ? <Link to={paths.home.getHref()}>Go to your start page</Link> : <Link to={paths.signIn.getHref()}>Go to sign in</Link>}
    </>
  );
}
