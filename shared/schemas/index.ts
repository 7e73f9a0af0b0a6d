export * from './roles';
export * from './api-error.schema';
export * from './common.schema';
export * from './auth.schema';
export * from './admin.schema';
export * from './study.schema';
export * from './specimen.schema';
export * from './analysis.schema';
