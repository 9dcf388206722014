export * from './organisations.table.js';
export * from './users.table.js';
export * from './auth.table.js';
export * from './sites.table.js';
export * from './inspections.table.js';
export * from './catalogue.table.js';
export * from './findings.table.js';
export * from './photos.table.js';
