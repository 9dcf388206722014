/**
 * Conversions between SI and the units shown on screens. Every factor is exact by definition
 * (NIST Special Publication 811, 2008 edition, Appendix B): the international pound is
 * 0.45359237 kg and the international foot 0.3048 m (1959 international yard and pound agreement),
 * the mile 1609.344 m, the pound-force 0.45359237 kg × 9.80665 m/s².
 */
import type { Joules, Kilograms, Metres, MetresPerSecond, Newtons } from './quantities.js';

/** Kilograms per international avoirdupois pound (exact). */
export const KILOGRAMS_PER_POUND = 0.45359237;
/** Metres per international foot (exact). */
export const METRES_PER_FOOT = 0.3048;
/** Metres per second per mile per hour: 1609.344 m / 3600 s (exact). */
export const METRES_PER_SECOND_PER_MPH = 0.44704;
/** Metres per second per kilometre per hour: 1000 m / 3600 s (exact). */
export const METRES_PER_SECOND_PER_KMH = 1 / 3.6;
/** Newtons per pound-force: 0.45359237 kg × 9.80665 m/s² (exact). */
export const NEWTONS_PER_POUND_FORCE = 4.4482216152605;
/** Joules per foot pound-force: 0.3048 m × 4.4482216152605 N (exact). */
export const JOULES_PER_FOOT_POUND_FORCE = METRES_PER_FOOT * NEWTONS_PER_POUND_FORCE;

/** Kilograms (kg) to pounds (lb). */
export const kilogramsToPounds = (mass: Kilograms | number): number => mass / KILOGRAMS_PER_POUND;
/** Pounds (lb) to kilograms (kg). */
export const poundsToKilograms = (pounds: number): Kilograms =>
  (pounds * KILOGRAMS_PER_POUND) as Kilograms;

/** Metres (m) to feet (ft). */
export const metresToFeet = (length: Metres | number): number => length / METRES_PER_FOOT;
/** Feet (ft) to metres (m). */
export const feetToMetres = (feet: number): Metres => (feet * METRES_PER_FOOT) as Metres;

/** Metres per second (m/s) to miles per hour (mph). */
export const metresPerSecondToMph = (speed: MetresPerSecond | number): number =>
  speed / METRES_PER_SECOND_PER_MPH;
/** Miles per hour (mph) to metres per second (m/s). */
export const mphToMetresPerSecond = (mph: number): MetresPerSecond =>
  (mph * METRES_PER_SECOND_PER_MPH) as MetresPerSecond;

/** Metres per second (m/s) to kilometres per hour (km/h). */
export const metresPerSecondToKmh = (speed: MetresPerSecond | number): number => speed * 3.6;
/** Kilometres per hour (km/h) to metres per second (m/s). */
export const kmhToMetresPerSecond = (kmh: number): MetresPerSecond =>
  (kmh / 3.6) as MetresPerSecond;

/** Joules (J) to foot pound-force (ft·lbf). */
export const joulesToFootPounds = (energy: Joules | number): number =>
  energy / JOULES_PER_FOOT_POUND_FORCE;
/** Foot pound-force (ft·lbf) to joules (J). */
export const footPoundsToJoules = (footPounds: number): Joules =>
  (footPounds * JOULES_PER_FOOT_POUND_FORCE) as Joules;

/** Newtons (N) to pound-force (lbf). */
export const newtonsToPoundsForce = (force: Newtons | number): number =>
  force / NEWTONS_PER_POUND_FORCE;
/** Pound-force (lbf) to newtons (N). */
export const poundsForceToNewtons = (poundsForce: number): Newtons =>
  (poundsForce * NEWTONS_PER_POUND_FORCE) as Newtons;
