/**
 * The handover record of a scaffold: what the erector handed over and under which design.
 * Load classes are the duty the platforms were designed for; the loads beside them are recalled
 * from memory of the standards named (check the standard before relying on a figure).
 */
import { z } from 'zod';

/**
 * UK and European practice: service classes 1–6 of EN 12811-1:2003 Table 3 (uniformly distributed
 * load 0.75, 1.5, 2.0, 3.0, 4.5, 6.0 kN/m², from memory). US practice: light, medium and heavy duty
 * of OSHA 29 CFR 1926 Subpart L Appendix A (25, 50, 75 lb/ft², from memory).
 */
export const LOAD_CLASSES = ['class-1', 'class-2', 'class-3', 'class-4', 'class-5', 'class-6', 'light-duty', 'medium-duty', 'heavy-duty'] as const;
export const LoadClassSchema = z.enum(LOAD_CLASSES, 'A load class from the list');
export type LoadClass = z.infer<typeof LoadClassSchema>;

/** Plummet's words for each load class, with its design load (from memory of the standard named). */
export const LOAD_CLASS_WORDS: Readonly<Record<LoadClass, string>> = {
  'class-1': 'Class 1 – inspection only, 0.75 kN/m²',
  'class-2': 'Class 2 – light duty, 1.5 kN/m²',
  'class-3': 'Class 3 – general purpose, 2.0 kN/m²',
  'class-4': 'Class 4 – heavy duty, 3.0 kN/m²',
  'class-5': 'Class 5 – masonry, 4.5 kN/m²',
  'class-6': 'Class 6 – special duty, 6.0 kN/m²',
  'light-duty': 'Light duty – 25 lb/ft²',
  'medium-duty': 'Medium duty – 50 lb/ft²',
  'heavy-duty': 'Heavy duty – 75 lb/ft²',
};

/** A calendar date as YYYY-MM-DD (no time: the day the scaffold was handed over). */
export const CalendarDateSchema = z.iso.date('A date as YYYY-MM-DD, e.g. 2026-03-04');

/** The handover fields of a scaffold, as sent and as answered (each may be unknown). */
export const scaffoldHandoverFields = {
  loadClass: LoadClassSchema.nullable(),
  /** The design drawing or calculation the scaffold was erected to (e.g. "TG20 compliance sheet 12"). */
  designReference: z.string().trim().max(200, 'At most 200 characters'),
  /** Who erected it (the scaffolding contractor). */
  erectingContractor: z.string().trim().max(200, 'At most 200 characters'),
  handedOverOn: CalendarDateSchema.nullable(),
};
