/**
 * Building blocks of the API schemas: ids, texts and physical quantities with the sane ranges the
 * server enforces (a negative mass, a height over 1,000 m or a 10 MB note is refused with the
 * field named in the error).
 */
import { z } from 'zod';

/** Limits of the API, in one place so the phone's forms can show them too. */
export const LIMITS = {
  /** Names, references, positions: characters. */
  nameMax: 200,
  /** Free-text notes and report paragraphs: characters. */
  noteMax: 4000,
  /** A drawn signature as an SVG path string: characters. */
  signatureMax: 100_000,
  /** Item mass, kg (0 < m ≤ 5,000). */
  massMaxKg: 5000,
  /** Drop height, m (0 < h ≤ 1,000). */
  heightMaxM: 1000,
  /** Wind speed, m/s (0–60; 60 m/s is beyond any recorded UK gust). */
  windMaxMps: 60,
  /** Longest dimension of an item, m. */
  dimensionMaxM: 25,
  /** Rows per page of any list. */
  listLimitMax: 200,
  listLimitDefault: 50,
} as const;

/** A record id (UUID; phones generate them for records made offline). */
export const IdSchema = z.uuid();

/** A short required name (trimmed, 1–200 characters). */
export const NameSchema = z.string().trim().min(1).max(LIMITS.nameMax);

/** A short optional text (0–200 characters), e.g. a position. */
export const ShortTextSchema = z.string().trim().max(LIMITS.nameMax);

/** A free-text note or report paragraph (0–4,000 characters). */
export const NoteSchema = z.string().max(LIMITS.noteMax);

/** A required report paragraph (1–4,000 characters). */
export const RequiredNoteSchema = z.string().trim().min(1).max(LIMITS.noteMax);

/** An instant as ISO 8601 with an offset or Z, e.g. 2025-03-04T09:30:00Z. */
export const DateTimeSchema = z.iso.datetime({ offset: true });

/** Mass in kg: 0 < m ≤ 5,000. */
export const MassKgSchema = z.number().positive().max(LIMITS.massMaxKg);

/** Height in m: 0 < h ≤ 1,000. */
export const HeightMSchema = z.number().positive().max(LIMITS.heightMaxM);

/** Wind speed in m/s: 0–60. */
export const WindSpeedMpsSchema = z.number().min(0).max(LIMITS.windMaxMps);

/** An optimistic version: when sent with an update, a stale one is refused with 409 CONFLICT. */
export const VersionSchema = z.number().int().positive();

/** An IANA time zone that this runtime knows, e.g. Europe/London. */
export const TimeZoneSchema = z
  .string()
  .min(1)
  .max(64)
  .refine((tz) => {
    try {
      new Intl.DateTimeFormat('en-GB', { timeZone: tz });
      return true;
    } catch {
      return false;
    }
  }, 'Unknown time zone');
