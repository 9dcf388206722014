/**
 * Vertical fall with quadratic air drag, in closed form.
 *
 * Downward is positive. With k = ρ·Cd·A / (2m) the motion is dv/dt = g − k·v·|v|, and the terminal
 * speed is v_t = √(g/k) = √(2 m g / (ρ Cd A)). Closed forms (any text on projectile motion with
 * quadratic drag, e.g. Taylor, Classical Mechanics 2005, §2.4):
 *
 * - speed after a drop y from a downward speed v0 (below or above terminal):
 *   v² = v_t² + (v0² − v_t²)·e^(−2gy/v_t²)         (from rest: v = v_t √(1 − e^(−2gy/v_t²)))
 * - time of that drop:  t = y/v_t + (v_t/g)·ln((v_t + v)/(v_t + v0))
 *   (from dt = dv / (g − k v²); equal to (v_t/g)[artanh(v/v_t) − artanh(v0/v_t)] below terminal
 *   and the arcoth form above it, written here without cancellation)
 * - rise of an upward throw u to its apex: H = (v_t²/2g)·ln(1 + u²/v_t²), in t = (v_t/g)·atan(u/v_t)
 *
 * The forms are evaluated with expm1/log1p so that weak drag (v_t → ∞) and long drops stay exact.
 */
import type { Kilograms, KilogramsPerCubicMetre, Metres, MetresPerSecond, MetresPerSecondSquared, Seconds, SquareMetres } from '../units/quantities.js';
import { ISA_SEA_LEVEL_AIR_DENSITY, STANDARD_GRAVITY } from './constants.js';

/** Terminal speed v_t = √(2 m g / (ρ Cd·A)) in m/s; Infinity when Cd·A is 0 (no drag). */
export function terminalVelocity(
  mass: Kilograms | number,
  dragArea: SquareMetres | number,
  airDensity: KilogramsPerCubicMetre | number = ISA_SEA_LEVEL_AIR_DENSITY,
  gravity: MetresPerSecondSquared | number = STANDARD_GRAVITY,
): MetresPerSecond {
  const denominator = airDensity * dragArea;
  return (denominator > 0 ? Math.sqrt((2 * mass * gravity) / denominator) : Infinity) as MetresPerSecond;
}

/** Result of a fall in still air: speed and time at the struck level, and the rise of an upward throw. */
export interface StillAirFall {
  /** Speed at the struck level, m/s. */
  speedMps: number;
  /** Time from release to the struck level, s (an upward throw includes its rise). */
  timeS: number;
  /** Height of the apex above the release point for an upward throw, m; 0 otherwise. */
  riseM: number;
}

/**
 * Writes the still-air fall into `out` (no allocation: the hot path of assessDrop reuses one
 * object). Inputs are SI and already validated: height > 0, gravity > 0, terminal speed > 0 or
 * Infinity; initial velocity positive downward, negative upward. The usual case (a drop or a
 * downward throw with drag) is kept short so that the compiler can inline it into its caller; the
 * rare ones (no drag, an upward toss) are separate functions.
 */
export function stillAirFallInto(
  out: StillAirFall,
  height: number,
  initialVelocity: number,
  terminal: number,
  gravity: number,
): StillAirFall {
  if (terminal === Infinity) return vacuumFallInto(out, height, initialVelocity, gravity);
  if (initialVelocity < 0) return tossFallInto(out, height, -initialVelocity, terminal, gravity);
  const vt = terminal;
  const vt2 = vt * vt;
  const v0 = initialVelocity;
  const s = (2 * gravity * height) / vt2;
  // 1 − e^(−s), exact for small s; past s = 38 it rounds to 1 in double precision, and skipping the
  // call avoids the slow underflow path of exp for long drops of light items.
  const reached = s < 38 ? -Math.expm1(-s) : 1;
  const carried = v0 === 0 || s > 745 ? 0 : v0 * v0 * Math.exp(-s); // share of the release speed left
  const v = Math.sqrt(vt2 * reached + carried);
  const gained = ((vt2 - v0 * v0) * reached) / (v + v0); // v − v0 without cancellation
  out.speedMps = v;
  out.timeS = height / vt + (vt / gravity) * Math.log1p(gained / (vt + v0));
  out.riseM = 0;
  return out;
}

/** No drag: v = √(v0² + 2gh); an upward toss rises u²/2g first. */
function vacuumFallInto(out: StillAirFall, height: number, initialVelocity: number, gravity: number): StillAirFall {
  if (initialVelocity >= 0) {
    const v = Math.sqrt(initialVelocity * initialVelocity + 2 * gravity * height);
    out.speedMps = v;
    out.timeS = (2 * height) / (v + initialVelocity);
    out.riseM = 0;
  } else {
    const u = -initialVelocity;
    const v = Math.sqrt(u * u + 2 * gravity * height);
    out.speedMps = v;
    out.timeS = (u + v) / gravity;
    out.riseM = (u * u) / (2 * gravity);
  }
  return out;
}

/** An upward toss at `u` m/s with drag: the rise to the apex, then a drop from rest of height + rise. */
function tossFallInto(out: StillAirFall, height: number, u: number, vt: number, gravity: number): StillAirFall {
  const vt2 = vt * vt;
  const ratio = u / vt;
  const rise = (vt2 / (2 * gravity)) * Math.log1p(ratio * ratio);
  const drop = height + rise;
  const sDrop = (2 * gravity * drop) / vt2;
  const v = vt * Math.sqrt(sDrop < 38 ? -Math.expm1(-sDrop) : 1);
  out.speedMps = v;
  out.timeS = (vt / gravity) * Math.atan(ratio) + drop / vt + (vt / gravity) * Math.log1p(v / vt);
  out.riseM = rise;
  return out;
}

/** Still-air fall from a release `height` above the struck level (m), SI in, SI out. */
export function stillAirFall(
  height: Metres | number,
  initialVelocity: MetresPerSecond | number,
  terminal: MetresPerSecond | number,
  gravity: MetresPerSecondSquared | number = STANDARD_GRAVITY,
): StillAirFall {
  return stillAirFallInto({ speedMps: 0, timeS: 0, riseM: 0 }, height, initialVelocity, terminal, gravity);
}

/** Speed in m/s after a drop of `height` m from rest: v_t √(1 − e^(−2gh/v_t²)). */
export function speedFromRest(
  height: Metres | number,
  terminal: MetresPerSecond | number,
  gravity: MetresPerSecondSquared | number = STANDARD_GRAVITY,
): MetresPerSecond {
  if (terminal === Infinity) return Math.sqrt(2 * gravity * height) as MetresPerSecond;
  const s = (2 * gravity * height) / (terminal * terminal);
  return (terminal * Math.sqrt(s < 38 ? -Math.expm1(-s) : 1)) as MetresPerSecond;
}

/** Speed in m/s with no air at all, the worst case: √(v0² + 2gh) for any direction of v0. */
export function vacuumSpeed(
  height: Metres | number,
  initialVelocity: MetresPerSecond | number = 0,
  gravity: MetresPerSecondSquared | number = STANDARD_GRAVITY,
): MetresPerSecond {
  return Math.sqrt(initialVelocity * initialVelocity + 2 * gravity * height) as MetresPerSecond;
}

/** Apex of an upward throw at `upwardSpeed` m/s with drag: rise in m and time to apex in s. */
export function riseWithDrag(
  upwardSpeed: MetresPerSecond | number,
  terminal: MetresPerSecond | number,
  gravity: MetresPerSecondSquared | number = STANDARD_GRAVITY,
): { riseM: Metres; timeS: Seconds } {
  if (terminal === Infinity) {
    return { riseM: ((upwardSpeed * upwardSpeed) / (2 * gravity)) as Metres, timeS: (upwardSpeed / gravity) as Seconds };
  }
  const ratio = upwardSpeed / terminal;
  return {
    riseM: (((terminal * terminal) / (2 * gravity)) * Math.log1p(ratio * ratio)) as Metres,
    timeS: ((terminal / gravity) * Math.atan(ratio)) as Seconds,
  };
}
