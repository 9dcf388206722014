/**
 * Quintic Hermite interpolation over one integration step, from the value, slope and curvature at
 * both ends (position, velocity and acceleration are all known there). Its error is of order h⁶,
 * in keeping with the fifth-order steps of the drift integrator, so the crossing of the struck
 * level inside the last step is found to the integrator's accuracy.
 */

/** Quintic Hermite interpolant on one step from values, slopes and curvatures at both ends. */
export function hermite(y0: number, d0: number, c0: number, y1: number, d1: number, c1: number, h: number, s: number): number {
  const s2 = s * s, s3 = s2 * s, s4 = s3 * s, s5 = s4 * s;
  const h0 = 1 - 10 * s3 + 15 * s4 - 6 * s5;
  const h1 = s - 6 * s3 + 8 * s4 - 3 * s5;
  const h2 = 0.5 * s2 - 1.5 * s3 + 1.5 * s4 - 0.5 * s5;
  const h3 = 0.5 * s3 - s4 + 0.5 * s5;
  const h4 = -4 * s3 + 7 * s4 - 3 * s5;
  const h5 = 10 * s3 - 15 * s4 + 6 * s5;
  return y0 * h0 + h * d0 * h1 + h * h * c0 * h2 + h * h * c1 * h3 + h * d1 * h4 + y1 * h5;
}

/** Time derivative of the interpolant (per unit of scaled time). */
export function hermiteSlope(y0: number, d0: number, c0: number, y1: number, d1: number, c1: number, h: number, s: number): number {
  const s2 = s * s, s3 = s2 * s, s4 = s3 * s;
  const g0 = -30 * s2 + 60 * s3 - 30 * s4;
  const g1 = 1 - 18 * s2 + 32 * s3 - 15 * s4;
  const g2 = s - 4.5 * s2 + 6 * s3 - 2.5 * s4;
  const g3 = 1.5 * s2 - 4 * s3 + 2.5 * s4;
  const g4 = -12 * s2 + 28 * s3 - 15 * s4;
  const g5 = 30 * s2 - 60 * s3 + 30 * s4;
  return (y0 * g0 + y1 * g5) / h + d0 * g1 + h * c0 * g2 + h * c1 * g3 + d1 * g4;
}

/** Fraction of the step where the interpolated height reaches `target` (Newton kept inside a bisection bracket). */
export function crossingFraction(y0: number, d0: number, c0: number, y1: number, d1: number, c1: number, h: number, target: number): number {
  let lo = 0, hi = 1;
  let s = (target - y0) / (y1 - y0);
  if (!(s > 0 && s < 1)) s = 0.5;
  for (let i = 0; i < 60; i++) {
    const f = hermite(y0, d0, c0, y1, d1, c1, h, s) - target;
    if (f < 0) lo = s; else hi = s;
    const slope = hermiteSlope(y0, d0, c0, y1, d1, c1, h, s) * h;
    let next = slope > 0 ? s - f / slope : 0.5 * (lo + hi);
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    if (Math.abs(next - s) <= 1e-15) return next;
    s = next;
  }
  return s;
}
