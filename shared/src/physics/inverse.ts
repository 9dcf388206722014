/**
 * Inverse questions: the height at which an item first reaches a given impact energy, and the
 * largest mass (with a given Cd·A) that stays below an energy at a given height. Still air, same
 * closed forms as assessDrop.
 */
import type { Kilograms, Metres } from '../units/quantities.js';
import { ISA_SEA_LEVEL_AIR_DENSITY, STANDARD_GRAVITY } from './constants.js';
import { dragAreaFromShape } from './drag.js';
import { riseWithDrag, stillAirFall, terminalVelocity } from './fall.js';
import type { ShapeSpec } from './shape.js';
import { dropIssue, DropInputError, shapeIssuesOf, type DropFieldIssue } from './validation.js';

interface Conditions {
  /** Drag area Cd·A, m² (≥ 0); when absent from `shape`; with neither, no drag. */
  dragAreaM2?: number;
  shape?: ShapeSpec;
  /** Vertical release speed, m/s, positive downward; default 0. */
  initialVelocityMps?: number;
  /** kg/m³; default 1.225. */
  airDensityKgM3?: number;
  /** m/s²; default 9.80665. */
  gravityMps2?: number;
}

export interface HeightForEnergyInput extends Conditions {
  /** Mass, kg (> 0). */
  massKg: number;
  /** Impact energy to reach, J (> 0). */
  energyJ: number;
}

export interface MassForEnergyInput extends Conditions {
  /** Vertical drop to the struck level, m (> 0). */
  heightM: number;
  /** Impact energy to stay below, J (> 0). */
  energyJ: number;
}

function check(input: Record<string, unknown>, required: readonly string[]): void {
  const issues: DropFieldIssue[] = [];
  const numeric = (field: string, rule: 'positive' | 'non-negative' | 'finite', isRequired: boolean) => {
    const value = input[field];
    if (value === undefined || value === null) {
      if (isRequired) issues.push(dropIssue(field, 'required'));
      return;
    }
    if (typeof value !== 'number' || value !== value) issues.push(dropIssue(field, 'not-a-number'));
    else if (!Number.isFinite(value)) issues.push(dropIssue(field, 'not-finite'));
    else if (rule === 'positive' && !(value > 0)) issues.push(dropIssue(field, 'not-positive'));
    else if (rule === 'non-negative' && value < 0) issues.push(dropIssue(field, 'negative'));
  };
  for (const field of required) numeric(field, 'positive', true);
  numeric('dragAreaM2', 'non-negative', false);
  numeric('initialVelocityMps', 'finite', false);
  numeric('airDensityKgM3', 'positive', false);
  numeric('gravityMps2', 'positive', false);
  if (input.shape != null && input.dragAreaM2 == null) issues.push(...(shapeIssuesOf(input.shape) ?? []));
  if (issues.length > 0) throw new DropInputError(issues);
}

const dragAreaOf = (c: Conditions): number =>
  c.dragAreaM2 ?? (c.shape != null ? dragAreaFromShape(c.shape) : 0);

/**
 * Height in m at which an item of `massKg` first reaches `energyJ` at the struck level, in still
 * air: 0 when it has that energy just below the release point; Infinity when its terminal energy
 * (m v_t² / 2) stays at or below the target.
 *
 * Thrown down (or released at rest), the speed rises or falls monotonically towards v_t from v0,
 * so the energy "at release" is the release energy. Tossed up, the item first rises to its apex
 * and passes the release level on the way down at a speed below u whenever there is drag
 * (v_t u / √(v_t² + u²)), so the answer is the drop from rest that reaches the energy, less the
 * rise, and 0 only when that is not positive.
 */
export function heightForEnergy(input: HeightForEnergyInput): Metres {
  check(input as unknown as Record<string, unknown>, ['massKg', 'energyJ']);
  const g = input.gravityMps2 ?? STANDARD_GRAVITY;
  const v0 = input.initialVelocityMps ?? 0;
  const target2 = (2 * input.energyJ) / input.massKg; // speed² to reach
  const vt = terminalVelocity(input.massKg, dragAreaOf(input), input.airDensityKgM3 ?? ISA_SEA_LEVEL_AIR_DENSITY, g);
  if (vt === Infinity) return (v0 * v0 >= target2 ? 0 : (target2 - v0 * v0) / (2 * g)) as Metres; // energy conservation
  const vt2 = vt * vt;
  if (v0 >= 0) {
    if (v0 * v0 >= target2) return 0 as Metres; // already there at release (and a throw above v_t only slows to v_t)
    if (target2 >= vt2) return Infinity as Metres;
    // v² = v_t² + (v0² − v_t²) e^(−2gh/v_t²)  ⇒  h = (v_t²/2g) ln((v_t² − v0²)/(v_t² − v²))
    return ((vt2 / (2 * g)) * Math.log1p((target2 - v0 * v0) / (vt2 - target2))) as Metres;
  }
  if (target2 >= vt2) return Infinity as Metres;
  // Upward toss: it falls from its apex; the drop from rest that reaches the energy, less the rise.
  const fromRest = (vt2 / (2 * g)) * Math.log1p(target2 / (vt2 - target2));
  const below = fromRest - riseWithDrag(-v0, vt, g).riseM;
  return (below > 0 ? below : 0) as Metres;
}

/**
 * Largest mass in kg, with the given Cd·A, whose impact energy after `heightM` metres stays below
 * `energyJ` (the energy rises with mass at fixed Cd·A, so the answer is the mass where it equals
 * the limit). With no drag it is E / (g h + v0²/2).
 */
export function massForEnergy(input: MassForEnergyInput): Kilograms {
  check(input as unknown as Record<string, unknown>, ['heightM', 'energyJ']);
  const g = input.gravityMps2 ?? STANDARD_GRAVITY;
  const rho = input.airDensityKgM3 ?? ISA_SEA_LEVEL_AIR_DENSITY;
  const v0 = input.initialVelocityMps ?? 0;
  const h = input.heightM;
  const limit = input.energyJ;
  const dragArea = dragAreaOf(input);
  const vacuumMass = limit / (g * h + 0.5 * v0 * v0);
  if (dragArea === 0) return vacuumMass as Kilograms;
  const energyOf = (m: number) => {
    const v = stillAirFall(h, v0, terminalVelocity(m, dragArea, rho, g), g).speedMps;
    return 0.5 * m * v * v;
  };
  // Drag only lowers the energy, so the vacuum mass is a lower bound; double to bracket.
  let lo = vacuumMass;
  let hi = vacuumMass * 2;
  for (let i = 0; i < 2000 && energyOf(hi) < limit; i++) { lo = hi; hi *= 2; }
  // Bisection in log m to full precision.
  for (let i = 0; i < 200 && hi - lo > 1e-14 * hi; i++) {
    const mid = Math.sqrt(lo * hi);
    if (energyOf(mid) < limit) lo = mid; else hi = mid;
  }
  return lo as Kilograms;
}
