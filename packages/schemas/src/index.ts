export * from './health';
