import { boolean, integer, json, jsonb, pgEnum, pgTable, primaryKey, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { syncStampColumns } from './columns.js';
import { organisations } from './organisations.table.js';

export const unitsEnum = pgEnum('units', ['si', 'imperial']);

/** Wind speed's own display unit (m/s, km/h, mph); values are always stored in m/s. */
export const windUnitsEnum = pgEnum('wind_units', ['mps', 'kmh', 'mph']);

export const roleEnum = pgEnum('role', ['inspector', 'foreman', 'manager', 'admin']);

export const users = pgTable('users', {
  id: uuid('id').primaryKey().defaultRandom(),
  /** Stored lower-cased; unique across the service. */
  email: text('email').notNull().unique(),
  name: text('name').notNull(),
  position: text('position').notNull().default(''),
  passwordHash: text('password_hash'),
  active: boolean('active').notNull().default(true),
  /** Display units chosen by the user; values are always stored in SI. */
  units: unitsEnum('units').notNull().default('si'),
  /** Display unit for wind speed, chosen apart from `units` (mph on a site measured in metres). */
  windUnits: windUnitsEnum('wind_units').notNull().default('mps'),
  /**
   * Carried in every access token; raised when the user's sessions must end before their tokens
   * expire (deactivation, role change, password reset). The guard refuses tokens of an older version.
   */
  sessionVersion: integer('session_version').notNull().default(0),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  /** Bumped by every change of the profile or settings, so pushed edits merge per field. */
  version: integer('version').notNull().default(1),
  /** Per-field write history of the profile and settings (see sync.table.ts). */
  syncFields: json('sync_fields').notNull().default({}),
  /** The change feed carries a user's own profile and settings to their phones (read by id). */
  ...syncStampColumns(),
});

/** A user's role in one organisation. */
export const memberships = pgTable(
  'memberships',
  {
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    organisationId: uuid('organisation_id')
      .notNull()
      .references(() => organisations.id, { onDelete: 'cascade' }),
    role: roleEnum('role').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.userId, t.organisationId] })],
);
