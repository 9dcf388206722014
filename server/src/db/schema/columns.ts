import { integer, timestamp } from 'drizzle-orm/pg-core';

export const createdAt = () => timestamp('created_at', { withTimezone: true }).notNull().defaultNow();
export const updatedAt = () => timestamp('updated_at', { withTimezone: true }).notNull().defaultNow();
/** Optimistic version: bumped on every write; sync compares it per field. */
export const version = () => integer('version').notNull().default(1);
