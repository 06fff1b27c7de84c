export * from './roles';
export * from './auth';
export * from './api';
export * from './data';
export * from './notes';
