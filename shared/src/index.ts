export * from './roles';
export * from './auth';
export * from './errors';
export * from './allergens';
export * from './book';
