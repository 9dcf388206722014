/**
 * Severity 1–5 of a fall estimate from its impact energy and peak force, against a threshold table.
 * The result says in words the estimate's own figure and the reference it reached. The words are
 * put together when first read (JSON, the "how computed" sheet), so rating an estimate costs one
 * small object and no string work.
 */
import type { Exposure } from '../physics/exposure.js';
import { EXPOSURES } from '../physics/exposure.js';
import { DEFAULT_SEVERITY_TABLE, SEVERITY_LABELS, type SeverityLevel, type SeverityTable, type SeverityThreshold } from './severity-table.js';

export interface Severity {
  readonly level: SeverityLevel;
  readonly label: string;
  /** Which reference the estimate crossed, in words, with its source. */
  readonly basis: string;
}

/** Thrown when an organisation's severity table is malformed. */
export class SeverityTableError extends Error {
  constructor(
    readonly field: string,
    message: string,
  ) {
    super(message);
    this.name = 'SeverityTableError';
  }
}

/**
 * Relative tolerance of every threshold comparison: a value within one part in 10⁹ below a threshold
 * counts as reaching it, so the level never depends on the order of floating-point operations
 * (the EN 397 striker on the helmet spring computes 4999.999999999999 N against 5,000 N).
 */
export const SEVERITY_RELATIVE_TOLERANCE = 1e-9;
const REACH = 1 - SEVERITY_RELATIVE_TOLERANCE;

/** Tables already checked, with their rating order. */
const checkedTables = new WeakMap<SeverityTable, TableOrder>();

/** A figure as the basis quotes it: three significant figures, J, N below 1 kN, kN above. */
function formatQuantity(quantity: 'energy' | 'force', value: number): string {
  const three = (x: number) => String(Number(x.toPrecision(3)));
  if (quantity === 'energy') return `${three(value)} J`;
  return value >= 1000 ? `${three(value / 1000)} kN` : `${three(value)} N`;
}

function basisOf(
  threshold: SeverityThreshold | undefined,
  thresholds: readonly SeverityThreshold[],
  exposure: Exposure,
  energyJ: number,
  peakForceN: number,
): string {
  if (threshold !== undefined) {
    const what = threshold.quantity === 'energy' ? 'Impact energy' : 'Peak force';
    const figure = threshold.quantity === 'energy' ? energyJ : peakForceN;
    return `${what} ${formatQuantity(threshold.quantity, figure)} reaches ${formatQuantity(threshold.quantity, threshold.atLeast)}, ${threshold.reference} (${threshold.source}).`;
  }
  const lowest = (q: 'energy' | 'force') => thresholds.filter((t) => t.quantity === q).sort((a, b) => a.atLeast - b.atLeast)[0];
  const parts = [lowest('energy'), lowest('force')].filter((t): t is SeverityThreshold => t !== undefined);
  const who = exposure === 'helmet' ? 'a helmeted head' : 'a bare head';
  return (
    `Impact energy ${formatQuantity('energy', energyJ)} and peak force ${formatQuantity('force', peakForceN)}, below every reference for ${who}` +
    (parts.length ? `: under ${parts.map((t) => `${formatQuantity(t.quantity, t.atLeast)}, ${t.reference}`).join('; and under ')}.` : '.')
  );
}

/**
 * A rating: level and label at once, the basis in words when first read. JSON carries the three
 * fields (toJSON); code that copies a rating field by field reads `basis` like any property.
 */
class RatedSeverity implements Severity {
  readonly level: SeverityLevel;
  readonly label: string;
  private words: string | undefined;

  constructor(
    private readonly threshold: SeverityThreshold | undefined,
    private readonly thresholds: readonly SeverityThreshold[],
    private readonly exposure: Exposure,
    private readonly energyJ: number,
    private readonly peakForceN: number,
  ) {
    this.level = threshold === undefined ? 1 : threshold.level;
    this.label = SEVERITY_LABELS[this.level];
    this.words = undefined;
  }

  get basis(): string {
    return (this.words ??= basisOf(this.threshold, this.thresholds, this.exposure, this.energyJ, this.peakForceN));
  }

  toJSON(): { level: SeverityLevel; label: string; basis: string } {
    return { level: this.level, label: this.label, basis: this.basis };
  }
}

/**
 * One exposure's thresholds ready for rating: highest level first, the listed order kept within a
 * level, so the first one reached is the answer (the highest level; on a tie the rule listed first).
 */
interface RatingOrder {
  readonly list: readonly SeverityThreshold[];
  readonly ordered: readonly SeverityThreshold[];
  /** atLeast × (1 − tolerance) of each ordered threshold. */
  readonly reach: Float64Array;
  /** 1 when the ordered threshold is on energy, 0 on force. */
  readonly onEnergy: Uint8Array;
}

function ratingOrder(list: readonly SeverityThreshold[]): RatingOrder {
  const ordered = list
    .map((t, i) => ({ t, i }))
    .sort((a, b) => b.t.level - a.t.level || a.i - b.i)
    .map(({ t }) => t);
  return {
    list,
    ordered,
    reach: Float64Array.from(ordered, (t) => t.atLeast * REACH),
    onEnergy: Uint8Array.from(ordered, (t) => (t.quantity === 'energy' ? 1 : 0)),
  };
}

interface TableOrder {
  readonly 'bare-head': RatingOrder;
  readonly helmet: RatingOrder;
}

const tableOrder = (table: SeverityTable): TableOrder => ({ 'bare-head': ratingOrder(table['bare-head']), helmet: ratingOrder(table.helmet) });

/** A plain copy of a rating (level, label, basis), for storage that keeps own data properties only. */
export function plainSeverity(severity: Severity): Severity {
  return { level: severity.level, label: severity.label, basis: severity.basis };
}

/** Checks an organisation's table once (levels 2–5, positive finite thresholds, a source on each). */
export function validateSeverityTable(table: SeverityTable): void {
  orderOfCheckedTable(table);
}

/** Checks a table once and returns its rating order. */
function orderOfCheckedTable(table: SeverityTable): TableOrder {
  const known = checkedTables.get(table);
  if (known !== undefined) return known;
  for (const exposure of EXPOSURES) {
    const list = table?.[exposure];
    if (!Array.isArray(list)) throw new SeverityTableError(exposure, `The severity table has no list for ${exposure}.`);
    list.forEach((t: SeverityThreshold, i: number) => {
      const field = `${exposure}[${i}]`;
      if (![2, 3, 4, 5].includes(t?.level)) throw new SeverityTableError(`${field}.level`, 'A threshold level must be 2, 3, 4 or 5.');
      if (t.quantity !== 'energy' && t.quantity !== 'force') throw new SeverityTableError(`${field}.quantity`, 'A threshold is on energy or force.');
      if (typeof t.atLeast !== 'number' || !(t.atLeast > 0) || !Number.isFinite(t.atLeast)) {
        throw new SeverityTableError(`${field}.atLeast`, 'A threshold value must be a positive finite number.');
      }
      if (typeof t.source !== 'string' || t.source.trim() === '') throw new SeverityTableError(`${field}.source`, 'Every threshold needs its source.');
      if (typeof t.reference !== 'string' || t.reference.trim() === '') throw new SeverityTableError(`${field}.reference`, 'Every threshold needs its reference in words.');
    });
  }
  const order = tableOrder(table);
  checkedTables.set(table, order);
  return order;
}

/**
 * Severity of an impact of `energyJ` joules and `peakForceN` newtons on `exposure`. The highest
 * level whose energy or force threshold is reached (within SEVERITY_RELATIVE_TOLERANCE) wins; on a
 * tie the rule listed first is named. The basis quotes the estimate's own figure (three significant
 * figures), then the threshold it reaches.
 */
export function rateSeverity(
  energyJ: number,
  peakForceN: number,
  exposure: Exposure,
  table: SeverityTable = DEFAULT_SEVERITY_TABLE,
): Severity {
  const orders = table === DEFAULT_SEVERITY_TABLE ? DEFAULT_ORDER : orderOfCheckedTable(table);
  const order = exposure === 'helmet' ? orders.helmet : orders['bare-head'];
  const reach = order.reach;
  const onEnergy = order.onEnergy;
  let best: SeverityThreshold | undefined;
  for (let i = 0; i < reach.length; i++) {
    if ((onEnergy[i] === 1 ? energyJ : peakForceN) >= reach[i]!) {
      best = order.ordered[i];
      break;
    }
  }
  return new RatedSeverity(best, order.list, exposure, energyJ, peakForceN);
}

const DEFAULT_ORDER = tableOrder(DEFAULT_SEVERITY_TABLE);
