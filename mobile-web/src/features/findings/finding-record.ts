/**
 * From a read form to the stored finding and the bodies the server will receive. The estimate is
 * computed with the same shared code the server runs (estimateFinding → assessDrop), so the phone
 * and the server agree; the server recomputes it anyway and never trusts a client's figure.
 */
import {
  estimateFinding,
  FindingSchema,
  IdSchema,
  PHYSICS_EXPOSURE,
  sameValue,
  type DropInput,
  type FindingCreate,
  type FindingEstimateInput,
  type FindingEstimateResult,
  type FindingItemInput,
  type FindingUpdate,
} from '@plummet/shared';
import type { FindingRecord } from '../../local-db/records';
import type { FindingForm, ResolvedItem } from './finding-form';

export interface FindingOwner {
  id: string;
  organisationId: string;
  siteId: string;
  scaffoldId: string;
  inspectionId: string | null;
  createdBy: string;
}

/** The estimate for an input, or undefined when the physics refuses it (it names the field). */
export function tryEstimate(input: FindingEstimateInput | undefined): { result?: FindingEstimateResult; problem?: string } {
  if (!input) return {};
  try {
    return { result: estimateFinding(input) };
  } catch (error) {
    return { problem: error instanceof Error ? error.message : 'The estimate could not be computed.' };
  }
}

/** The physics input behind a finding's estimate, as estimateFinding builds it (for "how this was computed"). */
export function dropInputOf(input: FindingEstimateInput): DropInput {
  return {
    massKg: input.massKg,
    heightM: input.heightM,
    ...(input.shape ? { shape: input.shape } : {}),
    ...(input.windSpeedMps != null && input.windSpeedMps > 0 ? { windSpeedMps: input.windSpeedMps } : {}),
    exposure: PHYSICS_EXPOSURE[input.exposure],
  };
}

export function buildFindingRecord(
  owner: FindingOwner,
  form: FindingForm,
  item: ResolvedItem,
  input: FindingEstimateInput,
  result: FindingEstimateResult,
  previous: FindingRecord | undefined,
  now: Date,
): FindingRecord {
  const madeSafeNow = form.madeSafe && previous?.state !== 'made-safe';
  const state = madeSafeNow ? 'made-safe' : (previous?.state ?? 'open');
  return {
    ...owner,
    elevation: form.elevation,
    lift: form.lift,
    bay: form.bay,
    heightM: input.heightM,
    item,
    exposure: form.exposure,
    likelihoodAnswers: form.answers,
    likelihood: result.likelihood,
    estimate: { ...result.estimate, likelihood: { ...result.estimate.likelihood, reasons: [...result.estimate.likelihood.reasons] }, resolved: { ...result.estimate.resolved } },
    severity: result.severity,
    riskScore: result.riskScore,
    riskBand: result.riskBand,
    state,
    assigneeId: previous?.assigneeId ?? null,
    dueAt: previous?.dueAt ?? null,
    overdue: previous?.overdue ?? false,
    notes: form.notes,
    madeSafeNote: madeSafeNow ? form.madeSafeNote.trim() : (previous?.madeSafeNote ?? null),
    madeSafeUntil: previous?.madeSafeUntil ?? null,
    handBack: previous?.handBack ?? null,
    createdAt: previous?.createdAt ?? now.toISOString(),
    updatedAt: now.toISOString(),
    version: previous?.version ?? 0,
  };
}

function itemInputOf(item: FindingRecord['item']): FindingItemInput {
  return item.catalogueItemId ? { catalogueItemId: item.catalogueItemId } : { name: item.name, massKg: item.massKg, shape: item.shape };
}

/** The body of `POST /api/findings` for a finding made on the phone. */
export function findingCreateOf(finding: FindingRecord): FindingCreate {
  return {
    id: finding.id,
    scaffoldId: finding.scaffoldId,
    inspectionId: finding.inspectionId,
    elevation: finding.elevation,
    lift: finding.lift,
    bay: finding.bay,
    heightM: finding.heightM,
    item: itemInputOf(finding.item),
    exposure: finding.exposure,
    likelihoodAnswers: finding.likelihoodAnswers,
    notes: finding.notes,
  };
}

type EditableFields = Omit<FindingCreate, 'id' | 'scaffoldId' | 'inspectionId'>;

function editableFieldsOf(finding: FindingRecord): EditableFields {
  const { id: _id, scaffoldId: _scaffold, inspectionId: _inspection, ...fields } = findingCreateOf(finding);
  return fields;
}

/**
 * The body of an edit: ONLY the fields that differ from `previous` (the finding as it was before
 * the edit), with the version the edit started from. The server merges field by field, so a field
 * sent unchanged would overwrite another phone's edit of it. Without `previous`, every field.
 * Undefined when nothing changed.
 */
export function findingUpdateOf(finding: FindingRecord, previous?: FindingRecord): FindingUpdate | undefined {
  const fields = editableFieldsOf(finding);
  const before = previous ? editableFieldsOf(previous) : undefined;
  const changed = Object.fromEntries(
    Object.entries(fields).filter(([field, value]) => !before || !sameValue(value, (before as Record<string, unknown>)[field])),
  ) as Partial<EditableFields>;
  if (!Object.keys(changed).length) return undefined;
  const version = previous?.version ?? finding.version;
  return { ...changed, ...(version > 0 ? { version } : {}) };
}

const FindingRecordSchema = FindingSchema.extend({ organisationId: IdSchema, siteId: IdSchema });

/** A finding read back from the database, or undefined when it is not one. */
export function restoreFinding(value: unknown): FindingRecord | undefined {
  const parsed = FindingRecordSchema.safeParse(value);
  return parsed.success ? (parsed.data as FindingRecord) : undefined;
}

/**
 * A cheap check for long lists (2,000 findings re-read on every change): the fields a row shows.
 * The editor reads its one finding with restoreFinding.
 */
export function looksLikeFinding(value: unknown): value is FindingRecord {
  if (typeof value !== 'object' || value === null) return false;
  const f = value as Partial<FindingRecord>;
  return (
    typeof f.id === 'string' &&
    typeof f.scaffoldId === 'string' &&
    typeof f.riskScore === 'number' &&
    typeof f.riskBand === 'string' &&
    typeof f.heightM === 'number' &&
    typeof f.item === 'object' &&
    f.item !== null &&
    typeof f.estimate === 'object'
  );
}
