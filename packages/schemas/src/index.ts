export * from './common';
export * from './register';
export * from './auth';
export * from './users';
export * from './health';
export * from './work-orders';
export * from './readings';
export * from './site-health';
