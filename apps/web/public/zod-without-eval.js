// zod compiles fast parsers with Function() and probes for it when a schema is built; under the
// API's content security policy (script-src 'self', no 'unsafe-eval') that probe is a reported
// violation on every page. zod reads its settings from this global, so setting jitless here,
// before the app's module runs, skips the probe. A file of its own: the policy forbids inline scripts.
globalThis.__zod_globalConfig = Object.assign(globalThis.__zod_globalConfig || {}, { jitless: true });
