// Physics benchmark: still-air estimates per second, drift estimates per second, and the rate of
// assessDrop (validation, defaults, both impacts, forces, severity, the full result) against a bare
// loop of the same closed-form arithmetic, measured in the same run. Run with
// `npm run bench:physics` (builds shared first). Goals: ≥ 5 million still-air estimates/s on one
// core, at least half the bare loop's rate, and ≤ 100 µs per drift estimate. Two parts of the
// still-air estimate are also timed alone on the same inputs (the validation and the severity
// rating), so that the cost of each can be read beside the whole. Figures only; nothing is asserted.
import { assessDrop, firstDropInputIssue, integrateDrift, rateSeverity } from '../dist/index.js';

const G = 9.80665;
const RHO = 1.225;
const SKULL_K = 4_023_000; // N/m, the bare-head hard-item preset
const HALF_PI = Math.PI / 2;

// A fixed pseudo-random set of realistic findings: 1 g–50 kg, 0.5–300 m, Cd·A 1 cm²–0.25 m².
let seed = 12345;
const random = () => ((seed = (seed * 1103515245 + 12345) >>> 0) / 2 ** 32);
const logUniform = (min, max) => Math.exp(Math.log(min) + random() * (Math.log(max) - Math.log(min)));
const COUNT = 4096;
const stillInputs = [];
const windInputs = [];
const shapeInputs = [];
for (let i = 0; i < COUNT; i++) {
  const massKg = logUniform(0.001, 50);
  const heightM = logUniform(0.5, 300);
  const dragAreaM2 = logUniform(1e-4, 0.25);
  stillInputs.push({ massKg, heightM, dragAreaM2 });
  windInputs.push({ massKg, heightM, dragAreaM2, windSpeedMps: logUniform(1, 25) });
  const side = logUniform(0.02, 0.6);
  shapeInputs.push({ massKg, heightM, shape: { kind: 'box', lengthM: side, widthM: side * 0.6, heightM: side * 0.3 } });
}

/** The same closed-form arithmetic as assessDrop's still-air path for these inputs, with nothing else. */
function bareEstimate(m, h, cdA) {
  const vt = Math.sqrt((2 * m * G) / (RHO * cdA));
  const vt2 = vt * vt;
  const s = (2 * G * h) / vt2;
  const reached = -Math.expm1(-s);
  const v = Math.sqrt(vt2 * reached);
  const t = h / vt + (vt / G) * Math.log1p(v / vt);
  const energy = 0.5 * m * v * v;
  const duration = HALF_PI * Math.sqrt(m / SKULL_K);
  const peak = ((m * v) / duration) * HALF_PI;
  const vacuum = Math.sqrt(2 * G * h); // the worst-case speed every estimate carries
  return energy + peak + t + vacuum;
}

/**
 * The bare arithmetic again, returning an object of the same size and nesting as assessDrop's result
 * (the same fields, a severity, the resolved input and its contact; no validation, no defaults, no
 * rating): the floor that building the full result sets, for reading the ratio above.
 */
const DEFAULTS = Object.freeze(['initialVelocityMps', 'airDensityKgM3', 'gravityMps2', 'windSpeedMps', 'exposure', 'contact']);
function bareResult(m, h, cdA) {
  const vt = Math.sqrt((2 * m * G) / (RHO * cdA));
  const vt2 = vt * vt;
  const s = (2 * G * h) / vt2;
  const reached = -Math.expm1(-s);
  const v = Math.sqrt(vt2 * reached);
  const t = h / vt + (vt / G) * Math.log1p(v / vt);
  const energy = 0.5 * m * v * v;
  const duration = HALF_PI * Math.sqrt(m / SKULL_K);
  const mean = (m * v) / duration;
  const peak = mean * HALF_PI;
  const vacuum = Math.sqrt(2 * G * h);
  return {
    terminalVelocityMps: vt,
    impactVelocityMps: v,
    vacuumImpactVelocityMps: vacuum,
    fallTimeS: t,
    riseM: 0,
    impactEnergyJ: energy,
    meanForceN: mean,
    peakForceN: peak,
    driftM: 0,
    governingImpact: 'still-air',
    stillAirImpactVelocityMps: v,
    stillAirImpactEnergyJ: energy,
    stillAirPeakForceN: peak,
    windImpactVelocityMps: v,
    windImpactEnergyJ: energy,
    windPeakForceN: peak,
    severity: { level: 1, label: 'Negligible', threshold: undefined, thresholds: DEFAULTS, exposure: 'bare-head', energyJ: energy, peakForceN: peak, words: undefined },
    resolved: {
      massKg: m,
      heightM: h,
      initialVelocityMps: 0,
      dragAreaM2: cdA,
      dragAreaSource: 'input',
      airDensityKgM3: RHO,
      gravityMps2: G,
      windSpeedMps: 0,
      exposure: 'bare-head',
      contact: { durationS: duration, stoppingDistanceM: undefined, pulse: 'half-sine', presetId: 'hard-item-bare-head' },
      defaultsApplied: DEFAULTS,
    },
  };
}

/**
 * Nanoseconds per call: the best of several rounds after JIT warm-up, timed on the CPU time of
 * this process (so other work on a shared machine inflates the figures less than wall time would).
 */
function timeLoop(label, iterations, body) {
  let best = Infinity;
  let sink = 0;
  for (let round = 0; round < 9; round++) {
    const start = process.cpuUsage();
    sink += body(iterations);
    const used = process.cpuUsage(start);
    const ns = (used.user + used.system) * 1000;
    if (round >= 2) best = Math.min(best, ns); // the first rounds warm the JIT
  }
  if (!Number.isFinite(sink)) throw new Error(`${label}: non-finite result`);
  return best / iterations;
}

const N = 2_000_000;
const bareNs = timeLoop('bare', N, (n) => {
  let acc = 0;
  for (let i = 0; i < n; i++) {
    const x = stillInputs[i & (COUNT - 1)];
    acc += bareEstimate(x.massKg, x.heightM, x.dragAreaM2);
  }
  return acc;
});
const bareResultNs = timeLoop('bare with result objects', N, (n) => {
  let acc = 0;
  for (let i = 0; i < n; i++) {
    const x = stillInputs[i & (COUNT - 1)];
    acc += bareResult(x.massKg, x.heightM, x.dragAreaM2).impactEnergyJ;
  }
  return acc;
});
const stillNs = timeLoop('assessDrop still air', N, (n) => {
  let acc = 0;
  for (let i = 0; i < n; i++) acc += assessDrop(stillInputs[i & (COUNT - 1)]).impactEnergyJ;
  return acc;
});
const shapeNs = timeLoop('assessDrop with shape', N / 4, (n) => {
  let acc = 0;
  for (let i = 0; i < n; i++) acc += assessDrop(shapeInputs[i & (COUNT - 1)]).impactEnergyJ;
  return acc;
});
// Parts of the still-air estimate, each timed alone on the same inputs (both are inside assessDrop).
const validNs = timeLoop('validation alone', N, (n) => {
  let acc = 0;
  for (let i = 0; i < n; i++) acc += firstDropInputIssue(stillInputs[i & (COUNT - 1)]) === undefined ? 1 : 0;
  return acc;
});
const stillFigures = stillInputs.map((x) => assessDrop(x));
const ratingNs = timeLoop('severity rating alone', N, (n) => {
  let acc = 0;
  for (let i = 0; i < n; i++) {
    const d = stillFigures[i & (COUNT - 1)];
    acc += rateSeverity(d.impactEnergyJ, d.peakForceN, 'bare-head').level;
  }
  return acc;
});
const M = 20_000;
const driftNs = timeLoop('assessDrop with wind', M, (n) => {
  let acc = 0;
  for (let i = 0; i < n; i++) acc += assessDrop(windInputs[i & (COUNT - 1)]).driftM;
  return acc;
});

let steps = 0;
let worstSteps = 0;
for (const x of windInputs) {
  const d = assessDrop({ ...x, windSpeedMps: 0 });
  const r = integrateDrift(x.heightM, 0, d.terminalVelocityMps, G, x.windSpeedMps, d.fallTimeS);
  steps += r.steps + r.rejected;
  worstSteps = Math.max(worstSteps, r.steps + r.rejected);
}

const perSecond = (ns) => (1e9 / ns).toLocaleString('en-GB', { maximumFractionDigits: 0 });
console.log(`Node ${process.version}, one core (CPU time of this process), ${COUNT} varied inputs (1 g–50 kg, 0.5–300 m, Cd·A 1 cm²–0.25 m²)`);
console.log(`still-air estimates (assessDrop, Cd·A given):  ${perSecond(stillNs)} /s  (${stillNs.toFixed(1)} ns each; goal ≥ 5,000,000 /s)`);
console.log(`bare closed-form loop, same arithmetic:        ${perSecond(bareNs)} /s  (${bareNs.toFixed(1)} ns each)`);
console.log(`ratio of rates, assessDrop / bare loop:        ${(bareNs / stillNs).toFixed(2)}  (${(stillNs / bareNs).toFixed(2)} × the time; goal ≥ 0.5)`);
console.log(`bare loop building a result of the same shape: ${perSecond(bareResultNs)} /s  (${bareResultNs.toFixed(1)} ns each; ratio of rates to the bare loop ${(bareNs / bareResultNs).toFixed(2)}, assessDrop to it ${(bareResultNs / stillNs).toFixed(2)})`);
console.log(`parts of the still-air estimate, timed alone:  validation ${validNs.toFixed(1)} ns, severity rating ${ratingNs.toFixed(1)} ns (its words are put together only when read)`);
console.log(`still-air estimates with a box shape:          ${perSecond(shapeNs)} /s  (${shapeNs.toFixed(1)} ns each)`);
console.log(`drift estimates (assessDrop with wind):        ${perSecond(driftNs)} /s  (${(driftNs / 1000).toFixed(2)} µs each; goal ≤ 100 µs)`);
console.log(`drift integration steps: mean ${(steps / COUNT).toFixed(1)}, worst ${worstSteps} (wind 1–25 m/s)`);
