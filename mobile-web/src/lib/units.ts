/**
 * Display units at the screen's edge: values are SI everywhere else. The factors
 * come from @plummet/shared's conversions (exact by definition, NIST SP 811); the inch is
 * 0.0254 m exactly (1959 international yard and pound agreement).
 */
import {
  joulesToFootPounds,
  METRES_PER_FOOT,
  METRES_PER_SECOND_PER_KMH,
  METRES_PER_SECOND_PER_MPH,
  KILOGRAMS_PER_POUND,
  NEWTONS_PER_POUND_FORCE,
  type Units,
  type WindUnits,
} from '@plummet/shared';
import { lazyFormat } from './lazy-format';

export type { Units, WindUnits };

/** Metres per inch (exact). */
const METRES_PER_INCH = 0.0254;

export type QuantityKind = 'mass' | 'height' | 'distance' | 'size' | 'speed' | 'energy' | 'force' | 'time';

interface Scale {
  /** Display units per SI unit. */
  perSi: number;
  unit: string;
}

const SCALES: Record<QuantityKind, Record<Units, Scale>> = {
  mass: { si: { perSi: 1, unit: 'kg' }, imperial: { perSi: 1 / KILOGRAMS_PER_POUND, unit: 'lb' } },
  height: { si: { perSi: 1, unit: 'm' }, imperial: { perSi: 1 / METRES_PER_FOOT, unit: 'ft' } },
  distance: { si: { perSi: 1, unit: 'm' }, imperial: { perSi: 1 / METRES_PER_FOOT, unit: 'ft' } },
  /** Item dimensions: centimetres or inches, the way a tape reads. */
  size: { si: { perSi: 100, unit: 'cm' }, imperial: { perSi: 1 / METRES_PER_INCH, unit: 'in' } },
  speed: { si: { perSi: 1, unit: 'm/s' }, imperial: { perSi: 1 / METRES_PER_SECOND_PER_MPH, unit: 'mph' } },
  energy: { si: { perSi: 1, unit: 'J' }, imperial: { perSi: joulesToFootPounds(1), unit: 'ft·lbf' } },
  force: { si: { perSi: 1, unit: 'N' }, imperial: { perSi: 1 / NEWTONS_PER_POUND_FORCE, unit: 'lbf' } },
  time: { si: { perSi: 1, unit: 's' }, imperial: { perSi: 1, unit: 's' } },
};

export function unitLabel(kind: QuantityKind, units: Units): string {
  return SCALES[kind][units].unit;
}

/** An SI value in the display units. */
export function toDisplay(kind: QuantityKind, si: number, units: Units): number {
  return si * SCALES[kind][units].perSi;
}

/** A value typed in the display units, in SI. */
export function fromDisplay(kind: QuantityKind, shown: number, units: Units): number {
  return shown / SCALES[kind][units].perSi;
}

const threeFigures = lazyFormat(() => new Intl.NumberFormat('en-GB', { maximumSignificantDigits: 3 }));
const wholeNumber = lazyFormat(() => new Intl.NumberFormat('en-GB', { maximumFractionDigits: 0 }));

/** A number with three significant figures (whole numbers past 1,000), e.g. 12.3, 0.456, 1,234. */
export function formatNumber(value: number): string {
  if (!Number.isFinite(value)) return '—';
  return Math.abs(value) >= 1000 ? wholeNumber(value) : threeFigures(value);
}

/** An SI value shown in the user's units with its unit, e.g. "14.2 m/s", "46.6 mph", "4.81 kN". */
export function formatQuantity(kind: QuantityKind, si: number, units: Units): string {
  if (kind === 'force' && units === 'si' && Math.abs(si) >= 1000) return `${threeFigures(si / 1000)} kN`;
  return `${formatNumber(toDisplay(kind, si, units))} ${unitLabel(kind, units)}`;
}

/** A value for an input field in display units (no grouping, up to 3 decimals), e.g. "12.5". */
export function formatForInput(kind: QuantityKind, si: number | undefined, units: Units): string {
  if (si === undefined || !Number.isFinite(si)) return '';
  return String(Number(toDisplay(kind, si, units).toFixed(3)));
}

/** A number typed by a person: accepts a decimal comma; undefined when it is not a number. */
export function parseDecimal(text: string): number | undefined {
  const cleaned = text.trim().replace(',', '.');
  if (cleaned === '' || !/^[-+]?(\d+\.?\d*|\.\d+)$/.test(cleaned)) return undefined;
  const value = Number(cleaned);
  return Number.isFinite(value) ? value : undefined;
}

/** Text typed in display units, in SI; undefined when it is not a number. */
export function parseQuantity(kind: QuantityKind, text: string, units: Units): number | undefined {
  const shown = parseDecimal(text);
  return shown === undefined ? undefined : fromDisplay(kind, shown, units);
}

/** Wind speed has its own unit choice, apart from the display units (mph on a site measured in metres). */
const WIND_SCALES: Record<WindUnits, Scale> = {
  mps: { perSi: 1, unit: 'm/s' },
  kmh: { perSi: 1 / METRES_PER_SECOND_PER_KMH, unit: 'km/h' },
  mph: { perSi: 1 / METRES_PER_SECOND_PER_MPH, unit: 'mph' },
};

export function windUnitLabel(windUnits: WindUnits): string {
  return WIND_SCALES[windUnits].unit;
}

/** A wind speed in m/s shown in the user's wind unit, e.g. "20 mph". */
export function formatWind(mps: number, windUnits: WindUnits): string {
  return `${formatNumber(mps * WIND_SCALES[windUnits].perSi)} ${windUnitLabel(windUnits)}`;
}

/** A wind speed typed in the user's wind unit, in m/s; undefined when it is not a number. */
export function parseWind(text: string, windUnits: WindUnits): number | undefined {
  const shown = parseDecimal(text);
  return shown === undefined ? undefined : shown / WIND_SCALES[windUnits].perSi;
}

/** A wind speed in m/s for an input field in the user's wind unit (no unit, up to 1 decimal), e.g. "20". */
export function windForInput(mps: number | null | undefined, windUnits: WindUnits): string {
  if (mps === null || mps === undefined || !Number.isFinite(mps)) return '';
  return String(Number((mps * WIND_SCALES[windUnits].perSi).toFixed(1)));
}
