/**
 * Turns what an inspector sent into the stored columns of a finding: the position checked against
 * the scaffold, the item resolved from the catalogue or taken as given, and the estimate ALWAYS
 * recomputed here with the shared physics (a client's figures are not even read).
 */
import {
  DropInputError,
  estimateFinding,
  estimateRowText,
  type FindingCreate,
  type FindingExposure,
  type FindingItemInput,
  type LikelihoodAnswers,
  RiskInputError,
  sameValue,
  type ShapeSpec,
} from '@plummet/shared';
import { AppError, ErrorCode, type ErrorIssue } from '../common/app-error.js';
import type { CatalogueItemRow } from '../catalogue/catalogue.mapper.js';
import type { ScaffoldRow } from '../scaffolds/scaffold.mapper.js';
import type { AuthUser } from '../auth/auth.types.js';
import type { FindingRow } from './finding.mapper.js';
import type { FindingInsert } from './findings.repository.js';

/** Every column that follows from the inspector's input: position, item copy, estimate and risk. */
export type FindingComputedColumns = Required<
  Pick<
    FindingInsert,
    | 'elevation' | 'lift' | 'bay' | 'heightM' | 'catalogueItemId' | 'itemName' | 'massKg' | 'shape'
    | 'exposure' | 'likelihoodAnswers' | 'estimate' | 'estimateRow' | 'severity' | 'likelihood' | 'riskScore' | 'riskBand'
  >
>;

// A type literal (not an interface) so it also fits Record<string, unknown> (the sync merge reads it field by field).
export type FindingFields = {
  elevation: string;
  lift: number;
  bay: number;
  heightM: number;
  item: { catalogueItemId: string | null; name: string; massKg: number; shape: ShapeSpec | null };
  exposure: FindingExposure;
  likelihoodAnswers: LikelihoodAnswers;
};

const invalid = (issues: ErrorIssue[]) => new AppError(ErrorCode.ValidationFailed, 'The request is not valid', issues);

/** Elevation, lift and bay must exist on the scaffold (400 naming the field). */
export function checkPosition(fields: Pick<FindingFields, 'elevation' | 'lift' | 'bay'>, scaffold: ScaffoldRow): void {
  const issues: ErrorIssue[] = [];
  if (!scaffold.elevations.includes(fields.elevation)) {
    issues.push({ path: ['elevation'], code: 'not_on_scaffold', message: `The scaffold's elevations are: ${scaffold.elevations.join(', ')}` });
  }
  if (fields.lift > scaffold.lifts) issues.push({ path: ['lift'], code: 'too_big', message: `The scaffold has ${scaffold.lifts} lifts` });
  if (fields.bay > scaffold.baysPerElevation) {
    issues.push({ path: ['bay'], code: 'too_big', message: `The scaffold has ${scaffold.baysPerElevation} bays per elevation` });
  }
  if (issues.length) throw invalid(issues);
}

/** The item as stored: copied from the catalogue entry, or the custom one as given. */
export function resolveItem(input: FindingItemInput, catalogueItem: CatalogueItemRow | undefined): FindingFields['item'] {
  if (input.catalogueItemId !== undefined) {
    if (!catalogueItem) throw AppError.notFound('Catalogue item');
    return { catalogueItemId: catalogueItem.id, name: catalogueItem.name, massKg: catalogueItem.massKg, shape: catalogueItem.shape as ShapeSpec };
  }
  return { catalogueItemId: null, name: input.name!, massKg: input.massKg!, shape: input.shape ?? null };
}

/** Where a physics input field lives in the request body. */
function physicsFieldPath(field: string): string[] {
  const parts = field.split('.');
  return parts[0] === 'massKg' || parts[0] === 'shape' ? ['item', ...parts] : parts;
}

/** The stored columns of the item, position and estimate. Physics or risk refusals become 400s naming the field. */
export function findingColumns(fields: FindingFields, windSpeedMps: number | null): FindingComputedColumns {
  let result;
  try {
    result = estimateFinding({
      massKg: fields.item.massKg,
      heightM: fields.heightM,
      shape: fields.item.shape,
      exposure: fields.exposure,
      likelihoodAnswers: fields.likelihoodAnswers,
      windSpeedMps,
    });
  } catch (error) {
    if (error instanceof DropInputError) {
      throw invalid(error.issues.map((i) => ({ path: physicsFieldPath(i.field), code: i.code, message: i.message })));
    }
    if (error instanceof RiskInputError) throw invalid([{ path: ['likelihoodAnswers', error.field], code: error.code, message: error.message }]);
    throw error;
  }
  return {
    elevation: fields.elevation,
    lift: fields.lift,
    bay: fields.bay,
    heightM: fields.heightM,
    catalogueItemId: fields.item.catalogueItemId,
    itemName: fields.item.name,
    massKg: fields.item.massKg,
    shape: fields.item.shape,
    exposure: fields.exposure,
    likelihoodAnswers: fields.likelihoodAnswers,
    estimate: result.estimate,
    // The same estimate as the row a phone pulls (shared/src/sync/finding-rows.ts), written with it.
    estimateRow: estimateRowText(result.estimate),
    severity: result.severity,
    likelihood: result.likelihood,
    riskScore: result.riskScore,
    riskBand: result.riskBand,
  };
}

/**
 * The row of a new finding, the same for the REST route and for sync: computed columns plus who,
 * where and which organisation. Callers add their own extras (sync adds its field stamps).
 */
export function newFindingRow(
  user: AuthUser,
  input: FindingCreate,
  item: FindingFields['item'],
  scaffoldId: string,
  windSpeedMps: number | null,
): FindingInsert {
  return {
    ...findingColumns({ ...input, item }, windSpeedMps),
    id: input.id,
    organisationId: user.organisationId,
    scaffoldId,
    inspectionId: input.inspectionId,
    notes: input.notes,
    createdBy: user.userId,
  };
}

/** The syncable fields of a stored finding, as a patch names them. */
export function findingFieldValues(row: FindingRow): FindingFields & { notes: string } {
  return {
    elevation: row.elevation,
    lift: row.lift,
    bay: row.bay,
    heightM: row.heightM,
    item: { catalogueItemId: row.catalogueItemId, name: row.itemName, massKg: row.massKg, shape: (row.shape as ShapeSpec | null) ?? null },
    exposure: row.exposure,
    likelihoodAnswers: row.likelihoodAnswers as LikelihoodAnswers,
    notes: row.notes,
  };
}

const f4 = Math.fround;

/** A repeated create with the body the finding was made from (then it is a retry, not a conflict). */
export function sameCreate(row: FindingRow, input: FindingCreate): boolean {
  const item = input.item.catalogueItemId !== undefined
    ? row.catalogueItemId === input.item.catalogueItemId
    : row.catalogueItemId === null &&
      row.itemName === input.item.name &&
      f4(row.massKg) === f4(input.item.massKg!) &&
      sameValue(row.shape ?? null, input.item.shape ?? null);
  return (
    item &&
    row.scaffoldId === input.scaffoldId &&
    row.inspectionId === input.inspectionId &&
    row.elevation === input.elevation &&
    row.lift === input.lift &&
    row.bay === input.bay &&
    f4(row.heightM) === f4(input.heightM) &&
    row.exposure === input.exposure &&
    sameValue(row.likelihoodAnswers, input.likelihoodAnswers) &&
    row.notes === input.notes
  );
}
