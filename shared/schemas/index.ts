export * from './account.schema';
export * from './auth.schema';
export * from './error.schema';
export * from './plans.schema';
export * from './plan-revisions.schema';
export * from './plan-shares.schema';
export * from './plan-photos.schema';
export * from './work-record.schema';
