import { maxPageSize } from '../../register/api/list-params';
import { siteQueries, type SiteListParams } from '../../register/api/site-queries';

/** As many sites as one request brings (the API's page limit): enough to pick grants from. */
export const siteChoiceLimit = maxPageSize;

const firstPageByName: SiteListParams = { page: 1, pageSize: siteChoiceLimit, sort: 'name', q: '' };

/**
 * The sites the signed-in person may read (a viewer gets only theirs), by name: to grant sites
 * to viewers and for a viewer's own list. The register's own site list query, so a change to
 * the register refreshes it too.
 */
export const siteChoices = {
  list: () => siteQueries.list(firstPageByName),
};
