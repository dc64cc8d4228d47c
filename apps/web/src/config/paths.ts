/** A base path with its search parameters, when there are any. */
const withSearch = (base: string, search?: URLSearchParams) => {
  const query = search?.toString();
  return query ? `${base}?${query}` : base;
};

/**
 * Every route of the web app, in one place. Components link with `getHref`; the router
 * registers `path`.
 */
export const paths = {
  /** Sends a signed-in person on to the home of their role. */
  home: {
    path: '/',
    getHref: () => '/',
  },

  // Open to everyone.
  signIn: {
    path: '/sign-in',
    /** `next`: where to go after signing in (a path inside the app). */
    getHref: (next?: string) => (next ? `/sign-in?next=${encodeURIComponent(next)}` : '/sign-in'),
  },
  resetPassword: {
    path: '/reset-password',
    getHref: () => '/reset-password',
  },
  setPassword: {
    path: '/set-password',
    getHref: () => '/set-password',
  },

  // Each role's home.
  planningDesk: {
    path: '/planning',
    getHref: () => '/planning',
  },
  todaysOrders: {
    path: '/today',
    getHref: () => '/today',
  },
  reviewQueue: {
    path: '/review',
    getHref: () => '/review',
  },
  siteHealth: {
    path: '/site-health',
    getHref: () => '/site-health',
  },

  // People and access (administrators).
  people: {
    path: '/people',
    /** `search`: the table's state (page, pageSize, sort, q, role, status) as URL search. */
    getHref: (search?: URLSearchParams) => {
      const query = search?.toString();
      return query ? `/people?${query}` : '/people';
    },
  },
  invitePerson: {
    path: '/people/invite',
    getHref: () => '/people/invite',
  },
  person: {
    path: '/people/:id',
    getHref: (id: number) => `/people/${id}`,
  },
  auditLog: {
    path: '/audit-log',
    getHref: (search?: URLSearchParams) => {
      const query = search?.toString();
      return query ? `/audit-log?${query}` : '/audit-log';
    },
  },
  serviceHealth: {
    path: '/service-health',
    getHref: () => '/service-health',
  },

  account: {
    path: '/account',
    getHref: () => '/account',
  },

  // The register: sites → banks → steps → components.
  register: {
    sites: { path: '/sites', getHref: () => '/sites' },
    newSite: { path: '/sites/new', getHref: () => '/sites/new' },
    site: { path: '/sites/:siteId', getHref: (siteId: number) => `/sites/${siteId}` },
    editSite: { path: '/sites/:siteId/edit', getHref: (siteId: number) => `/sites/${siteId}/edit` },
    newBank: { path: '/sites/:siteId/banks/new', getHref: (siteId: number) => `/sites/${siteId}/banks/new` },
    bank: { path: '/banks/:bankId', getHref: (bankId: number) => `/banks/${bankId}` },
    editBank: { path: '/banks/:bankId/edit', getHref: (bankId: number) => `/banks/${bankId}/edit` },
    bankImport: { path: '/banks/:bankId/import', getHref: (bankId: number) => `/banks/${bankId}/import` },
    bankLabels: { path: '/banks/:bankId/labels', getHref: (bankId: number) => `/banks/${bankId}/labels` },
    step: { path: '/steps/:stepId', getHref: (stepId: number) => `/steps/${stepId}` },
    unit: { path: '/capacitor-units/:unitId', getHref: (unitId: number) => `/capacitor-units/${unitId}` },
    editUnit: { path: '/capacitor-units/:unitId/edit', getHref: (unitId: number) => `/capacitor-units/${unitId}/edit` },
    replaceUnit: { path: '/capacitor-units/:unitId/replace', getHref: (unitId: number) => `/capacitor-units/${unitId}/replace` },
    contactor: { path: '/contactors/:componentId', getHref: (id: number) => `/contactors/${id}` },
    reactor: { path: '/reactors/:componentId', getHref: (id: number) => `/reactors/${id}` },
    fuseSet: { path: '/fuse-sets/:componentId', getHref: (id: number) => `/fuse-sets/${id}` },
  },

  // Fleet health: what the readings mean for each site and for the whole fleet.
  fleetHealth: {
    path: '/fleet',
    getHref: () => '/fleet',
  },
  siteHealthOf: {
    path: '/sites/:siteId/health',
    /** `hoursPerMonth`: the hours of load the cost estimate assumes, when not the default. */
    getHref: (siteId: number, hoursPerMonth?: number) => `/sites/${siteId}/health${hoursPerMonth === undefined ? '' : `?hoursPerMonth=${hoursPerMonth}`}`,
  },

  // The technician's phone: an order on site (safety card, walk through the bank, submit).
  fieldOrder: {
    path: '/field/orders/:id',
    getHref: (id: number) => `/field/orders/${id}`,
  },

  // Work orders: the planner's table, calendar, load and forms, the supervisor's review, the signed record.
  workOrders: {
    list: { path: '/work-orders', getHref: (search?: URLSearchParams) => withSearch('/work-orders', search) },
    /** `month`: YYYY-MM; this month when absent. */
    calendar: { path: '/work-orders/calendar', getHref: (month?: string) => (month ? `/work-orders/calendar?month=${month}` : '/work-orders/calendar') },
    workload: { path: '/work-orders/workload', getHref: (search?: URLSearchParams) => withSearch('/work-orders/workload', search) },
    /** `prefill`: the bank (and kind) to start from, e.g. from a bank's page. */
    create: {
      path: '/work-orders/new',
      getHref: (prefill?: { bankId?: number; kind?: string }) =>
        withSearch('/work-orders/new', new URLSearchParams(Object.entries(prefill ?? {}).filter(([, v]) => v !== undefined).map(([k, v]) => [k, String(v)]))),
    },
    detail: { path: '/work-orders/:orderId', getHref: (id: number) => `/work-orders/${id}` },
    review: { path: '/work-orders/:orderId/review', getHref: (id: number) => `/work-orders/${id}/review` },
    record: { path: '/work-orders/:orderId/record', getHref: (id: number) => `/work-orders/${id}/record` },
  },
  plans: {
    list: { path: '/plans', getHref: (bankId?: number) => (bankId ? `/plans?bankId=${bankId}` : '/plans') },
    create: { path: '/plans/new', getHref: (bankId?: number) => (bankId ? `/plans/new?bankId=${bankId}` : '/plans/new') },
    edit: { path: '/plans/:planId', getHref: (id: number) => `/plans/${id}` },
  },
  flagQueue: {
    path: '/flags',
    getHref: (search?: URLSearchParams) => withSearch('/flags', search),
  },
} as const;
