/**
 * Heights of a scaffold's lifts. Lifts often differ (a taller first lift over a footpath, a short
 * top lift), so a scaffold may list one height per lift; with no list, every lift is `liftHeightM`.
 */

/** What the height of a lift depends on. `liftHeightsM` may be absent on records saved before it existed. */
export interface LiftHeightSource {
  lifts: number;
  /** The usual height of one lift, m. */
  liftHeightM: number;
  /** One height per lift from the bottom, m; empty: every lift is `liftHeightM`. */
  liftHeightsM?: readonly number[] | null;
}

/** The height of each lift from the bottom, m (always `lifts` long). */
export function liftHeightsOf(source: LiftHeightSource): number[] {
  const listed = source.liftHeightsM ?? [];
  return Array.from({ length: Math.max(0, source.lifts) }, (_, i) => listed[i] ?? source.liftHeightM);
}

/**
 * Height above the ground of lift `lift`'s platform, m: the sum of the heights of lifts 1…lift
 * (lift 0 is the ground). A lift above the top counts on with the usual height.
 */
export function liftPlatformHeightM(source: LiftHeightSource, lift: number): number {
  const listed = source.liftHeightsM ?? [];
  let height = 0;
  for (let i = 0; i < lift; i++) height += listed[i] ?? source.liftHeightM;
  return height;
}

/** The top working height, m: the platform of the highest lift. */
export function topPlatformHeightM(source: LiftHeightSource): number {
  return liftPlatformHeightM(source, source.lifts);
}
