/**
 * How a conflict's field and values read on screen, and how a typed value becomes one the server
 * accepts. Values stay SI; units are applied only here, at the screen's edge.
 */
import { type ControlResult, type FindingExposure, scaffoldStatusWords, type SyncConflict, type SyncEntity, type WindUnits } from '@plummet/shared';
import { formatDateTime } from '../../lib/format-date';
import { EXPOSURE_WORDS } from '../findings/finding-words';
import { RESULT_WORDS } from '../inspections/inspection-words';
import { REPORT_FIELD_LABELS } from '../inspections/report-draft';
import { formatQuantity, formatWind, parseQuantity, type Units } from '../../lib/units';

export const FIELD_WORDS: Record<string, string> = {
  notes: 'Notes',
  elevation: 'Elevation',
  lift: 'Lift',
  bay: 'Bay',
  heightM: 'Height of the drop',
  item: 'Item',
  exposure: 'Who is below',
  likelihoodAnswers: 'Likelihood answers',
  /** A scaffold's only synced field. */
  status: 'Tag status',
  // An inspection's report and weather.
  ...REPORT_FIELD_LABELS,
  windSpeedMps: 'Wind speed',
  // A control check.
  result: 'Result',
  note: 'Note',
  // The user's own settings.
  name: 'Name',
  position: 'Position',
  units: 'Units',
  windUnits: 'Wind speed unit',
};

/** What kind of record a conflict is on, as a person says it. */
export const ENTITY_WORDS: Record<SyncEntity, string> = {
  finding: 'Finding',
  inspection: 'Inspection',
  'control-check': 'Control check',
  scaffold: 'Scaffold',
  user: 'Your settings',
};

const UNITS_WORDS: Record<string, string> = { si: 'Metric (SI)', imperial: 'Imperial' };

export function fieldWords(field: string): string {
  return FIELD_WORDS[field] ?? field;
}

/** A field's value as a person reads it (wind in the user's wind unit, when given). */
export function valueWords(field: string, value: unknown, units: Units, windUnits?: WindUnits): string {
  if (value === null || value === undefined || value === '') return '(empty)';
  if (field === 'heightM' && typeof value === 'number') return formatQuantity('height', value, units);
  if (field === 'windSpeedMps' && typeof value === 'number') return formatWind(value, windUnits ?? (units === 'imperial' ? 'mph' : 'mps'));
  if (field === 'result' && typeof value === 'string') return RESULT_WORDS[value as ControlResult] ?? value;
  if (field === 'units' && typeof value === 'string') return UNITS_WORDS[value] ?? value;
  if (field === 'status' && typeof value === 'string') return scaffoldStatusWords(value);
  if (field === 'exposure' && typeof value === 'string') return EXPOSURE_WORDS[value as FindingExposure]?.label ?? value;
  if (field === 'item' && typeof value === 'object') {
    const item = value as { name?: string; massKg?: number };
    return [item.name ?? 'Item', typeof item.massKg === 'number' ? formatQuantity('mass', item.massKg, units) : ''].filter(Boolean).join(', ');
  }
  if (field === 'likelihoodAnswers' && typeof value === 'object') {
    return Object.entries(value as Record<string, unknown>)
      .map(([question, answer]) => `${question}: ${String(answer)}`)
      .join('; ');
  }
  return typeof value === 'string' || typeof value === 'number' ? String(value) : JSON.stringify(value);
}

/** Whether a value for this field can be typed on the conflict screen (the others are chosen in the finding editor). */
export function canTypeValue(field: string): boolean {
  return field === 'notes' || field === 'elevation' || field === 'lift' || field === 'bay' || field === 'heightM';
}

/** A typed value for the field, or a problem to show. */
export function parseTypedValue(field: string, text: string, units: Units): { value: unknown } | { problem: string } {
  if (field === 'notes') return { value: text };
  if (field === 'elevation') return text.trim() ? { value: text.trim() } : { problem: 'Type the elevation’s name.' };
  if (field === 'lift' || field === 'bay') {
    const n = Number(text.trim());
    return Number.isInteger(n) && n >= 1 ? { value: n } : { problem: `Type a whole ${field} number, 1 or more.` };
  }
  if (field === 'heightM') {
    const metres = parseQuantity('height', text, units);
    return metres !== undefined && metres > 0 ? { value: metres } : { problem: 'Type a height above zero.' };
  }
  return { problem: 'Choose this value in the finding editor.' };
}

/** A writer as the reader knows them: "you", their name, or "another user" when the server could not name them. */
export function writerWords(writerId: string | null, name: string | null, userId: string | undefined): string {
  if (writerId !== null && writerId === userId) return 'you';
  return name ?? 'another user';
}

/** Who wrote the value that did not stand, and when, as far as the server knows (older conflicts may not say). */
export function replacedWords(conflict: Pick<SyncConflict, 'replacedUserId' | 'replacedAt' | 'replacedName'>, userId: string | undefined): string {
  const who = conflict.replacedUserId === null ? 'written on another phone' : `written by ${writerWords(conflict.replacedUserId, conflict.replacedName, userId)}`;
  return conflict.replacedAt ? `${who}, ${formatDateTime(conflict.replacedAt)}` : who;
}
