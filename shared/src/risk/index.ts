export * from './severity-table.js';
export * from './severity.js';
export * from './risk-score.js';
export * from './likelihood.js';
