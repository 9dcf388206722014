export * from './caution.js';
