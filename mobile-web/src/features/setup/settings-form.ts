/**
 * The organisation settings form: every field of the shared settings schema, and the severity
 * table checked by the physics' own validator, each refusal under the field it is about.
 */
import {
  DEFAULT_SEVERITY_TABLE,
  EXPOSURES,
  OrganisationSettingsUpdateSchema,
  SeverityTableError,
  validateSeverityTable,
  type Exposure,
  type OrganisationSettings,
  type OrganisationSettingsUpdate,
  type SeverityTable,
} from '@plummet/shared';
import { parseDecimal } from '../../lib/units';
import { fieldErrorsOf, type FieldErrors } from './form-errors';

export interface ThresholdRow {
  level: string;
  quantity: 'energy' | 'force';
  atLeast: string;
  reference: string;
  source: string;
}

export type SeverityRows = Record<Exposure, ThresholdRow[]>;

export interface SettingsForm {
  fixDueHigh: string;
  fixDueMedium: string;
  proofPhotoRequiredForHigh: boolean;
  verifierMustDifferFromFixer: boolean;
  shiftEndsAt: string;
  timeZone: string;
  digestHour: string;
  clientCopyOfReports: boolean;
  keepPhotoLocation: boolean;
  defaultUnits: OrganisationSettings['defaultUnits'];
  /** null: Plummet's default bands. */
  severity: SeverityRows | null;
}

export function rowsOfTable(table: SeverityTable): SeverityRows {
  const rows = {} as SeverityRows;
  for (const exposure of EXPOSURES) {
    rows[exposure] = (table[exposure] ?? []).map((t) => ({ level: String(t.level), quantity: t.quantity, atLeast: String(t.atLeast), reference: t.reference, source: t.source }));
  }
  return rows;
}

export function settingsFormOf(settings: OrganisationSettings): SettingsForm {
  const table = settings.severityTable as SeverityTable | undefined;
  return {
    fixDueHigh: String(settings.fixDueHours.High),
    fixDueMedium: String(settings.fixDueHours.Medium),
    proofPhotoRequiredForHigh: settings.proofPhotoRequiredForHigh,
    verifierMustDifferFromFixer: settings.verifierMustDifferFromFixer,
    shiftEndsAt: settings.shiftEndsAt,
    timeZone: settings.timeZone,
    digestHour: String(settings.digestHour),
    clientCopyOfReports: settings.clientCopyOfReports,
    keepPhotoLocation: settings.keepPhotoLocation,
    defaultUnits: settings.defaultUnits,
    severity: table && typeof table === 'object' ? rowsOfTable(table) : null,
  };
}

/** A fresh copy of Plummet's default bands to start an organisation's own table from. */
export const defaultSeverityRows = (): SeverityRows => rowsOfTable(DEFAULT_SEVERITY_TABLE);

const number = (text: string) => parseDecimal(text) ?? Number.NaN;

function tableOf(rows: SeverityRows): unknown {
  const table: Record<string, unknown[]> = {};
  for (const exposure of EXPOSURES) {
    table[exposure] = rows[exposure].map((row) => ({
      level: number(row.level),
      quantity: row.quantity,
      atLeast: number(row.atLeast),
      reference: row.reference.trim(),
      source: row.source.trim(),
    }));
  }
  return table;
}

/** "bare-head[2].atLeast" → "severityTable.bare-head.2.atLeast", as the server names it. */
export const severityPath = (field: string) => ['severityTable', ...field.split(/[.[\]]+/).filter(Boolean)].join('.');

export type SettingsFormResult = { ok: true; body: OrganisationSettingsUpdate } | { ok: false; errors: FieldErrors };

export function readSettingsForm(form: SettingsForm): SettingsFormResult {
  const severityTable = form.severity === null ? null : tableOf(form.severity);
  const parsed = OrganisationSettingsUpdateSchema.safeParse({
    fixDueHours: { High: number(form.fixDueHigh), Medium: number(form.fixDueMedium) },
    proofPhotoRequiredForHigh: form.proofPhotoRequiredForHigh,
    verifierMustDifferFromFixer: form.verifierMustDifferFromFixer,
    shiftEndsAt: form.shiftEndsAt,
    timeZone: form.timeZone,
    digestHour: number(form.digestHour),
    clientCopyOfReports: form.clientCopyOfReports,
    keepPhotoLocation: form.keepPhotoLocation,
    defaultUnits: form.defaultUnits,
    severityTable,
  });
  const errors = parsed.success ? {} : fieldErrorsOf(parsed.error.issues);
  if (severityTable !== null) {
    try {
      validateSeverityTable(severityTable as SeverityTable);
    } catch (error) {
      if (!(error instanceof SeverityTableError)) throw error;
      errors[severityPath(error.field)] = error.message;
    }
  }
  return parsed.success && Object.keys(errors).length === 0 ? { ok: true, body: parsed.data } : { ok: false, errors };
}
