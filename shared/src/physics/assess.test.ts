import { describe, expect, it } from 'vitest';
import { CAUTION_TEXT } from '../caution.js';
import { assessDrop } from './assess.js';
import { dragAreaFromShape } from './drag.js';
import { explainDrop } from './explain.js';

describe('assessDrop', () => {
  it('lists every default it applied', () => {
    const drop = assessDrop({ massKg: 0.5, heightM: 8 });
    expect(drop.resolved.defaultsApplied).toEqual(['initialVelocityMps', 'dragAreaM2', 'airDensityKgM3', 'gravityMps2', 'windSpeedMps', 'exposure', 'contact']);
    expect(drop.resolved.airDensityKgM3).toBe(1.225); // ISA sea level, ICAO Doc 7488
    expect(drop.resolved.gravityMps2).toBe(9.80665); // standard gravity, 3rd CGPM 1901
    expect(drop.resolved.exposure).toBe('bare-head');
    expect(drop.resolved.dragAreaSource).toBe('none');
    expect(drop.resolved.contact).toMatchObject({ pulse: 'half-sine', presetId: 'hard-item-bare-head' });
  });

  it('prefers a given drag area to a shape, and takes it from the shape otherwise', () => {
    const shape = { kind: 'box', lengthM: 0.3, widthM: 0.2, heightM: 0.1 } as const;
    expect(assessDrop({ massKg: 2, heightM: 10, dragAreaM2: 0.01, shape }).resolved.dragAreaM2).toBe(0.01);
    const fromShape = assessDrop({ massKg: 2, heightM: 10, shape });
    expect(fromShape.resolved.dragAreaM2).toBe(dragAreaFromShape(shape));
    expect(fromShape.resolved.dragAreaSource).toBe('shape');
    expect(fromShape.resolved.defaultsApplied).toContain('shape.orientation');
  });

  it('reports drift 0 without wind and a positive drift in wind', () => {
    expect(assessDrop({ massKg: 0.2, heightM: 20, dragAreaM2: 0.01 }).driftM).toBe(0);
    expect(assessDrop({ massKg: 0.2, heightM: 20, dragAreaM2: 0.01, windSpeedMps: 0 }).driftM).toBe(0);
    expect(assessDrop({ massKg: 0.2, heightM: 20, windSpeedMps: 10 }).driftM).toBe(0); // no drag: the wind cannot carry it
    const windy = assessDrop({ massKg: 0.2, heightM: 20, dragAreaM2: 0.01, windSpeedMps: 10 });
    expect(windy.driftM).toBeGreaterThan(0);
    expect(windy.driftM).toBeLessThan(10 * 20); // slower than the wind for less than the time of a slow fall
  });

  it('reports the ground speed in the wind beside the still-air speed', () => {
    const calm = assessDrop({ massKg: 0.05, heightM: 20, dragAreaM2: 0.01 });
    expect(calm.windImpactVelocityMps).toBe(calm.impactVelocityMps);
    const windy = assessDrop({ massKg: 0.05, heightM: 20, dragAreaM2: 0.01, windSpeedMps: 15 });
    expect(windy.windImpactVelocityMps).toBeGreaterThan(windy.impactVelocityMps); // a light item is carried sideways near the wind speed
    expect(windy.windImpactVelocityMps).toBeLessThan(Math.hypot(15, windy.terminalVelocityMps)); // never faster than the wind plus terminal fall
  });

  it('makes the still-air results independent of the wind', () => {
    const calm = assessDrop({ massKg: 0.2, heightM: 20, dragAreaM2: 0.01 });
    const windy = assessDrop({ massKg: 0.2, heightM: 20, dragAreaM2: 0.01, windSpeedMps: 10 });
    expect(windy.impactVelocityMps).toBe(calm.impactVelocityMps);
    expect(windy.fallTimeS).toBe(calm.fallTimeS);
  });

  it('adds the rise of an upward toss to the fall', () => {
    const toss = assessDrop({ massKg: 1, heightM: 10, dragAreaM2: 0.005, initialVelocityMps: -6 });
    const rest = assessDrop({ massKg: 1, heightM: 10, dragAreaM2: 0.005 });
    expect(toss.riseM).toBeGreaterThan(0);
    expect(toss.impactVelocityMps).toBeGreaterThan(rest.impactVelocityMps);
    expect(toss.fallTimeS).toBeGreaterThan(rest.fallTimeS);
  });
});

describe('explainDrop', () => {
  it('lists the formulas that applied with their sources, the inputs with units and defaults, and the caution', () => {
    const explanation = explainDrop({ massKg: 1, heightM: 10, dragAreaM2: 0.01, windSpeedMps: 5, initialVelocityMps: -3 });
    const ids = explanation.formulas.map((f) => f.id);
    expect(ids).toEqual(expect.arrayContaining(['terminal-velocity', 'rise', 'fall-time', 'vacuum', 'energy', 'spring-contact', 'drift']));
    expect(ids).not.toContain('speed-thrown-down');
    for (const f of explanation.formulas) expect(f.source.length).toBeGreaterThan(5);
    const density = explanation.inputs.find((i) => i.field === 'airDensityKgM3')!;
    expect(density).toMatchObject({ value: 1.225, unit: 'kg/m³', defaulted: true });
    expect(density.source).toMatch(/ICAO Doc 7488/);
    expect(explanation.contactPreset?.id).toBe('hard-item-bare-head');
    expect(explanation.caution).toBe(CAUTION_TEXT);
    expect(explanation.assumptions.join(' ')).toMatch(/bounc/);
  });

  it('explains an assessment already computed without recomputing it', () => {
    const drop = assessDrop({ massKg: 1, heightM: 2, contact: { stoppingDistanceM: 0.01 } });
    const explanation = explainDrop(drop);
    expect(explanation.severityBasis).toBe(drop.severity.basis);
    expect(explanation.formulas.map((f) => f.id)).toContain('force-distance');
  });
});
