export * from './caution.js';
export * from './auth/roles.js';
