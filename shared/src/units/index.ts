export * from './quantities.js';
export * from './conversions.js';
