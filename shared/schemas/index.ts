export * from './roles';
export * from './api-error.schema';
export * from './common.schema';
export * from './auth.schema';
export * from './admin.schema';
