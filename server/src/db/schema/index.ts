export * from './organisations.table.js';
export * from './users.table.js';
