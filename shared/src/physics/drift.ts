/**
 * Horizontal drift of an item released into a steady horizontal wind.
 *
 * Drag acts on the velocity relative to the air, so the two directions are coupled:
 *   dvx/dt = −k |v_rel| (vx − w),   dvy/dt = g − k |v_rel| vy,   v_rel = (vx − w, vy),  k = ρCdA/(2m)
 * The item leaves with no horizontal speed and its vertical release speed (0 by default). There is
 * no closed form; this module integrates it with an embedded Runge–Kutta 5(4) pair with adaptive
 * step control (Dormand & Prince 1980, J. Comput. Appl. Math. 6(1):19–26; coefficients as in Hairer,
 * Nørsett & Wanner, Solving ODEs I, 2nd ed., Table 5.2). The step that crosses the struck level is
 * resolved with the quintic Hermite interpolant built from position, velocity and acceleration at
 * both ends of the step, then Newton/bisection for the exact crossing.
 *
 * Once the item moves with the wind at terminal speed (deviations below 1e-7), the rest of the fall
 * is finished with the linearised closed form instead of thousands of stability-limited steps.
 *
 * Units are scaled so that the numbers stay near 1: length 1/k, speed v_t, time v_t/g. Then
 * X'' = −q (U − W), Y'' = 1 − q V with q = |(U − W, V)| and W = w / v_t.
 */
import type { Metres, MetresPerSecond, Seconds } from '../units/quantities.js';
import { crossingFraction, hermite, hermiteSlope } from './hermite.js';
import { dropIssue, DropInputError } from './validation.js';

/** Relative tolerance per step of the integrator (dimensionless); keeps the drift error far below 0.1 %. */
export const DRIFT_RELATIVE_TOLERANCE = 1e-8;
const ABSOLUTE_TOLERANCE = 1e-13;
const MAX_STEPS = 100_000;

/** What the drift integration returns, SI units. */
export interface DriftResult {
  /** Horizontal distance carried by the wind before reaching the struck level, m. */
  driftM: Metres;
  /** Time to the struck level in the wind, s. */
  timeS: Seconds;
  /** Horizontal and vertical ground speed at the struck level, m/s. */
  horizontalSpeedMps: MetresPerSecond;
  verticalSpeedMps: MetresPerSecond;
  /** Accepted and rejected integration steps (for the benchmark and tests). */
  steps: number;
  rejected: number;
}

// Dormand–Prince 5(4) tableau.
const A21 = 1 / 5;
const A31 = 3 / 40, A32 = 9 / 40;
const A41 = 44 / 45, A42 = -56 / 15, A43 = 32 / 9;
const A51 = 19372 / 6561, A52 = -25360 / 2187, A53 = 64448 / 6561, A54 = -212 / 729;
const A61 = 9017 / 3168, A62 = -355 / 33, A63 = 46732 / 5247, A64 = 49 / 176, A65 = -5103 / 18656;
const B1 = 35 / 384, B3 = 500 / 1113, B4 = 125 / 192, B5 = -2187 / 6784, B6 = 11 / 84;
const E1 = 71 / 57600, E3 = -71 / 16695, E4 = 71 / 1920, E5 = -17253 / 339200, E6 = 22 / 525, E7 = -1 / 40;

/**
 * Drift (m) of an item in a steady wind, integrated in scaled units. Inputs are SI and validated by
 * the caller: terminal speed finite and > 0, wind > 0, height > 0.
 *
 * @param height      vertical distance to the struck level, m
 * @param initialVelocity vertical release speed, m/s, positive downward
 * @param terminal    still-air terminal speed, m/s
 * @param gravity     m/s²
 * @param wind        steady horizontal wind speed, m/s
 * @param timeScaleHint still-air fall time, s (sets the first step; any positive value works)
 */
export function integrateDrift(
  height: number,
  initialVelocity: number,
  terminal: number,
  gravity: number,
  wind: number,
  timeScaleHint: number,
): DriftResult {
  const lengthUnit = (terminal * terminal) / gravity; // 1/k
  const timeUnit = terminal / gravity;
  const target = height / lengthUnit;
  const W = wind / terminal;
  const tEstimate = timeScaleHint > 0 && Number.isFinite(timeScaleHint) ? timeScaleHint / timeUnit : Math.sqrt(2 * target);

  let t = 0, X = 0, Y = 0, U = 0, V = initialVelocity / terminal;
  // Acceleration at the current point (first stage, reused from the last stage: FSAL).
  let q = Math.sqrt((U - W) * (U - W) + V * V);
  let aU = -q * (U - W);
  let aV = 1 - q * V;
  let h = 0.01 * tEstimate;
  const hMax = Math.max(tEstimate, 1e-300);
  let steps = 0, rejected = 0;

  while (steps + rejected < MAX_STEPS) {
    if (h > hMax) h = hMax;
    // Stage 2..7: stage velocities (u_i, v_i) and their accelerations (p_i, r_i).
    const u2 = U + h * (A21 * aU), v2 = V + h * (A21 * aV);
    q = Math.sqrt((u2 - W) * (u2 - W) + v2 * v2);
    const p2 = -q * (u2 - W), r2 = 1 - q * v2;
    const u3 = U + h * (A31 * aU + A32 * p2), v3 = V + h * (A31 * aV + A32 * r2);
    q = Math.sqrt((u3 - W) * (u3 - W) + v3 * v3);
    const p3 = -q * (u3 - W), r3 = 1 - q * v3;
    const u4 = U + h * (A41 * aU + A42 * p2 + A43 * p3), v4 = V + h * (A41 * aV + A42 * r2 + A43 * r3);
    q = Math.sqrt((u4 - W) * (u4 - W) + v4 * v4);
    const p4 = -q * (u4 - W), r4 = 1 - q * v4;
    const u5 = U + h * (A51 * aU + A52 * p2 + A53 * p3 + A54 * p4);
    const v5 = V + h * (A51 * aV + A52 * r2 + A53 * r3 + A54 * r4);
    q = Math.sqrt((u5 - W) * (u5 - W) + v5 * v5);
    const p5 = -q * (u5 - W), r5 = 1 - q * v5;
    const u6 = U + h * (A61 * aU + A62 * p2 + A63 * p3 + A64 * p4 + A65 * p5);
    const v6 = V + h * (A61 * aV + A62 * r2 + A63 * r3 + A64 * r4 + A65 * r5);
    q = Math.sqrt((u6 - W) * (u6 - W) + v6 * v6);
    const p6 = -q * (u6 - W), r6 = 1 - q * v6;
    // Fifth-order solution.
    const Un = U + h * (B1 * aU + B3 * p3 + B4 * p4 + B5 * p5 + B6 * p6);
    const Vn = V + h * (B1 * aV + B3 * r3 + B4 * r4 + B5 * r5 + B6 * r6);
    const Xn = X + h * (B1 * U + B3 * u3 + B4 * u4 + B5 * u5 + B6 * u6);
    const Yn = Y + h * (B1 * V + B3 * v3 + B4 * v4 + B5 * v5 + B6 * v6);
    q = Math.sqrt((Un - W) * (Un - W) + Vn * Vn);
    const p7 = -q * (Un - W), r7 = 1 - q * Vn;
    // Embedded error estimate (5th minus 4th order).
    const eU = h * (E1 * aU + E3 * p3 + E4 * p4 + E5 * p5 + E6 * p6 + E7 * p7);
    const eV = h * (E1 * aV + E3 * r3 + E4 * r4 + E5 * r5 + E6 * r6 + E7 * r7);
    const eX = h * (E1 * U + E3 * u3 + E4 * u4 + E5 * u5 + E6 * u6 + E7 * Un);
    const eY = h * (E1 * V + E3 * v3 + E4 * v4 + E5 * v5 + E6 * v6 + E7 * Vn);
    const err = Math.max(
      Math.abs(eU) / (ABSOLUTE_TOLERANCE + DRIFT_RELATIVE_TOLERANCE * Math.max(Math.abs(U), Math.abs(Un))),
      Math.abs(eV) / (ABSOLUTE_TOLERANCE + DRIFT_RELATIVE_TOLERANCE * Math.max(Math.abs(V), Math.abs(Vn))),
      Math.abs(eX) / (ABSOLUTE_TOLERANCE + DRIFT_RELATIVE_TOLERANCE * Math.max(Math.abs(X), Math.abs(Xn))),
      Math.abs(eY) / (ABSOLUTE_TOLERANCE + DRIFT_RELATIVE_TOLERANCE * Math.max(Math.abs(Y), Math.abs(Yn))),
    );
    if (!(err <= 1)) {
      rejected++;
      const shrink = err === Infinity || err !== err ? 0.1 : Math.max(0.1, 0.9 * Math.pow(err, -0.2));
      h *= shrink;
      continue;
    }
    steps++;
    if (Yn >= target) {
      const theta = crossingFraction(Y, V, aV, Yn, Vn, r7, h, target);
      const driftScaled = hermite(X, U, aU, Xn, Un, p7, h, theta);
      const uAt = hermiteSlope(X, U, aU, Xn, Un, p7, h, theta);
      const vAt = hermiteSlope(Y, V, aV, Yn, Vn, r7, h, theta);
      return {
        driftM: (driftScaled * lengthUnit) as Metres,
        timeS: ((t + theta * h) * timeUnit) as Seconds,
        horizontalSpeedMps: (uAt * terminal) as MetresPerSecond,
        verticalSpeedMps: (vAt * terminal) as MetresPerSecond,
        steps,
        rejected,
      };
    }
    t += h; X = Xn; Y = Yn; U = Un; V = Vn; aU = p7; aV = r7;
    if (Math.abs(U - W) <= STEADY_DEVIATION && Math.abs(V - 1) <= STEADY_DEVIATION) {
      return steadyFinish(t, X, Y, U - W, V - 1, W, target, lengthUnit, timeUnit, terminal, steps, rejected);
    }
    const grow = err === 0 ? 5 : Math.min(5, 0.9 * Math.pow(err, -0.2));
    h *= grow;
  }
  // Only reachable far outside physical inputs; report it as an input problem rather than a wrong number.
  throw new DropInputError([dropIssue('driftM', 'out-of-range', 'the drift integration did not reach the struck level')]);
}

/**
 * Past the transient the item moves with the wind at terminal speed; the deviations u = U − W and
 * v = V − 1 then obey u' = −u, v' = −2v to first order (second-order terms are below 1e-14 at this
 * threshold). Finishing in closed form avoids thousands of stability-limited steps on long falls.
 */
const STEADY_DEVIATION = 1e-7;

function steadyFinish(
  t0: number, X0: number, Y0: number, u0: number, v0: number, W: number, target: number,
  lengthUnit: number, timeUnit: number, terminal: number, steps: number, rejected: number,
): DriftResult {
  // Y(τ) = Y0 + τ + (v0/2)(1 − e^(−2τ)) = target; Newton from τ = target − Y0 (monotone: Y' = 1 + v0 e^(−2τ) > 0).
  let tau = target - Y0;
  for (let i = 0; i < 20; i++) {
    const decay = Math.exp(-2 * tau);
    const f = Y0 + tau + 0.5 * v0 * -Math.expm1(-2 * tau) - target;
    const next = tau - f / (1 + v0 * decay);
    if (Math.abs(next - tau) <= 1e-15 * Math.max(1, tau)) { tau = next; break; }
    tau = next;
  }
  const X = X0 + W * tau + u0 * -Math.expm1(-tau);
  return {
    driftM: (X * lengthUnit) as Metres,
    timeS: ((t0 + tau) * timeUnit) as Seconds,
    horizontalSpeedMps: ((W + u0 * Math.exp(-tau)) * terminal) as MetresPerSecond,
    verticalSpeedMps: ((1 + v0 * Math.exp(-2 * tau)) * terminal) as MetresPerSecond,
    steps,
    rejected,
  };
}
