// The schema, split per area; drizzle.config.ts reads what this file exports.
export * from './messaging';
export * from './system';
export * from './access';
export * from './register';
export * from './work';
export * from './read-cache';
