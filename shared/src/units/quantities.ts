/**
 * Branded number types for SI quantities. A brand costs nothing at run time; it stops a value in
 * feet from being passed where metres are expected. Convert to other units only at a screen's edge
 * (see conversions.ts).
 */
declare const unitBrand: unique symbol;

/** A number carrying its unit in the type. */
export type Quantity<Unit extends string> = number & { readonly [unitBrand]: Unit };

/** Length in metres (m). */
export type Metres = Quantity<'m'>;
/** Area in square metres (m²), e.g. a drag area Cd·A. */
export type SquareMetres = Quantity<'m2'>;
/** Mass in kilograms (kg). */
export type Kilograms = Quantity<'kg'>;
/** Time in seconds (s). */
export type Seconds = Quantity<'s'>;
/** Speed in metres per second (m/s). */
export type MetresPerSecond = Quantity<'m/s'>;
/** Acceleration in metres per second squared (m/s²). */
export type MetresPerSecondSquared = Quantity<'m/s2'>;
/** Density in kilograms per cubic metre (kg/m³). */
export type KilogramsPerCubicMetre = Quantity<'kg/m3'>;
/** Force in newtons (N). */
export type Newtons = Quantity<'N'>;
/** Energy in joules (J). */
export type Joules = Quantity<'J'>;
/** Stiffness in newtons per metre (N/m). */
export type NewtonsPerMetre = Quantity<'N/m'>;

/** Marks a number as metres (m). */
export const metres = (value: number): Metres => value as Metres;
/** Marks a number as square metres (m²). */
export const squareMetres = (value: number): SquareMetres => value as SquareMetres;
/** Marks a number as kilograms (kg). */
export const kilograms = (value: number): Kilograms => value as Kilograms;
/** Marks a number as seconds (s). */
export const seconds = (value: number): Seconds => value as Seconds;
/** Marks a number as metres per second (m/s). */
export const metresPerSecond = (value: number): MetresPerSecond => value as MetresPerSecond;
/** Marks a number as metres per second squared (m/s²). */
export const metresPerSecondSquared = (value: number): MetresPerSecondSquared =>
  value as MetresPerSecondSquared;
/** Marks a number as kilograms per cubic metre (kg/m³). */
export const kilogramsPerCubicMetre = (value: number): KilogramsPerCubicMetre =>
  value as KilogramsPerCubicMetre;
/** Marks a number as newtons (N). */
export const newtons = (value: number): Newtons => value as Newtons;
/** Marks a number as joules (J). */
export const joules = (value: number): Joules => value as Joules;
/** Marks a number as newtons per metre (N/m). */
export const newtonsPerMetre = (value: number): NewtonsPerMetre => value as NewtonsPerMetre;
