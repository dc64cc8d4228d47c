/**
 * Every route of the web app, in one place. Components link with `getHref`; the router
 * registers `path`. Sections still to come: register, work orders, fleet health, people.
 */
export const paths = {
  home: {
    path: '/',
    getHref: () => '/',
  },
} as const;
