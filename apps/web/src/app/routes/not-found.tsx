import { Link } from 'react-router-dom';
import { PageHeader } from '../../components/page-header';
import { paths } from '../../config/paths';

export default function NotFoundRoute() {
  return (
    <>
      <PageHeader title="Nothing here" lead="This address does not lead to a page in Varden. It may have been mistyped or moved." />
      <Link to={paths.home.getHref()}>Go to Overview</Link>
    </>
  );
}
