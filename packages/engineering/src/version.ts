/**
 * Version of the engineering computations. The server stores it with every evaluation so a
 * stored result can be traced to the formulas and defaults that produced it. Bump the minor
 * version when a default or a formula changes results, the major when the API changes.
 */
export const ENGINEERING_VERSION = '1.0.0';
