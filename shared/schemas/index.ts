export * from './auth.schema';
export * from './error.schema';
export * from './plans.schema';
