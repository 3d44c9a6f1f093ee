export * from './roles';
export * from './auth';
export * from './errors';
export * from './allergens';
export * from './book';
export * from './nutrition';
export * from './declaration';
export * from './declaration-diff';
