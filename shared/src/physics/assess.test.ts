import { describe, expect, it } from 'vitest';
import { CAUTION_TEXT } from '../caution.js';
import { BUILTIN_ITEMS } from '../catalogue/builtin-items.js';
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

  it('returns plain data: every field an own property that JSON and spreads carry', () => {
    const drop = assessDrop({ massKg: 1.5, heightM: 12, dragAreaM2: 0.01 });
    const fields = [
      'terminalVelocityMps', 'impactVelocityMps', 'vacuumImpactVelocityMps', 'fallTimeS', 'riseM', 'impactEnergyJ', 'meanForceN',
      'peakForceN', 'driftM', 'governingImpact', 'stillAirImpactVelocityMps', 'stillAirImpactEnergyJ', 'stillAirPeakForceN',
      'windImpactVelocityMps', 'windImpactEnergyJ', 'windPeakForceN', 'severity', 'resolved',
    ];
    expect(Object.keys(drop)).toEqual(fields);
    const copy = JSON.parse(JSON.stringify(drop));
    expect(copy).toEqual({ ...drop, severity: { level: drop.severity.level, label: drop.severity.label, basis: drop.severity.basis }, resolved: { ...drop.resolved, contact: { ...drop.resolved.contact } } });
    expect(Object.keys(drop.resolved)).toContain('contact');
    expect({ ...drop.resolved.contact }).toEqual({ durationS: drop.resolved.contact.durationS, pulse: 'half-sine', presetId: 'hard-item-bare-head' });
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

  it('rates a light item in wind by its faster impact over the ground, keeping the still-air one beside it', () => {
    const calm = assessDrop({ massKg: 0.05, heightM: 20, dragAreaM2: 0.01 });
    expect(calm.windImpactVelocityMps).toBe(calm.impactVelocityMps);
    expect(calm.governingImpact).toBe('still-air');
    const windy = assessDrop({ massKg: 0.05, heightM: 20, dragAreaM2: 0.01, windSpeedMps: 15 });
    expect(windy.stillAirImpactVelocityMps).toBe(calm.impactVelocityMps); // the closed form does not see the wind
    expect(windy.governingImpact).toBe('wind');
    expect(windy.impactVelocityMps).toBe(windy.windImpactVelocityMps);
    expect(windy.impactEnergyJ).toBeCloseTo(0.5 * 0.05 * windy.windImpactVelocityMps ** 2, 12); // E = ½ m v² (definition)
    expect(windy.windImpactVelocityMps).toBeLessThan(Math.hypot(15, windy.terminalVelocityMps)); // never faster than the wind plus terminal fall
  });

  it('keeps the still-air impact when crosswind drag slows a heavy item a little', () => {
    // A dense item far from terminal speed: the wind adds almost no sideways speed but its drag
    // on the relative velocity slows the fall slightly, so the still-air impact is the worse one.
    const heavy = assessDrop({ massKg: 20, heightM: 60, dragAreaM2: 0.02, windSpeedMps: 3 });
    expect(heavy.windImpactVelocityMps).toBeLessThan(heavy.stillAirImpactVelocityMps);
    expect(heavy.governingImpact).toBe('still-air');
    expect(heavy.impactVelocityMps).toBe(heavy.stillAirImpactVelocityMps);
  });

  it('rates the built-in brick trowel from 20 m in a 12 m/s wind over a helmet by its ground speed: Minor becomes Moderate', () => {
    const trowel = BUILTIN_ITEMS.find((i) => i.name === 'Brick trowel')!;
    const still = assessDrop({ massKg: trowel.massKg, heightM: 20, shape: trowel.shape!, exposure: 'helmet' });
    expect(still.impactVelocityMps).toBeCloseTo(14.0, 1); // worked example: 14.0 m/s in still air
    expect(still.impactEnergyJ).toBeCloseTo(34.5, 1); // and 34.5 J
    expect(still.severity.level).toBe(2); // 34.5 J ≥ 24.5 J, half the EN 397 test energy
    const windy = assessDrop({ massKg: trowel.massKg, heightM: 20, shape: trowel.shape!, exposure: 'helmet', windSpeedMps: 12 });
    expect(windy.windImpactVelocityMps).toBeCloseTo(15.9, 1); // worked example: about 15.9 m/s over the ground
    expect(windy.impactEnergyJ).toBeCloseTo(44.1, 1); // about 44 J
    expect(windy.stillAirImpactEnergyJ).toBeCloseTo(34.5, 1);
    expect(windy.severity.level).toBe(3); // peak ≈ 4.74 kN ≥ 4,450 N, ANSI/ISEA Z89.1 Type I limit
  });

  it('rates a 0.2 kg plate from 30 m in a 20 m/s wind on a bare head by its ground speed: Major becomes Catastrophic', () => {
    const plate = { kind: 'plate', lengthM: 0.6, widthM: 0.3, thicknessM: 0.012 } as const;
    expect(assessDrop({ massKg: 0.2, heightM: 30, shape: plate }).severity.level).toBe(4); // worked example: level 4 in still air
    const windy = assessDrop({ massKg: 0.2, heightM: 30, shape: plate, windSpeedMps: 20 });
    expect(windy.windImpactVelocityMps).toBeCloseTo(21, 0); // worked example: about 21 m/s over the ground
    expect(windy.impactEnergyJ).toBeCloseTo(44, 0); // about 44 J
    expect(windy.severity.level).toBe(5); // peak ≈ 18.9 kN ≥ 14.1 kN, highest skull-fracture force (Yoganandan et al. 1995)
  });

  it('keeps the still-air fall time and closed-form speed independent of the wind', () => {
    const calm = assessDrop({ massKg: 0.2, heightM: 20, dragAreaM2: 0.01 });
    const windy = assessDrop({ massKg: 0.2, heightM: 20, dragAreaM2: 0.01, windSpeedMps: 10 });
    expect(windy.stillAirImpactVelocityMps).toBe(calm.impactVelocityMps);
    expect(windy.stillAirPeakForceN).toBe(calm.peakForceN);
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

  it('lists both impacts of an item in wind, the faster marked as governing, and only still air without wind', () => {
    const plate = { kind: 'plate', lengthM: 0.6, widthM: 0.3, thicknessM: 0.012 } as const;
    const windy = explainDrop({ massKg: 0.2, heightM: 30, shape: plate, windSpeedMps: 20 });
    expect(windy.impacts.map((i) => [i.id, i.governs])).toEqual([['still-air', false], ['wind', true]]);
    expect(windy.impacts[1]!.speedMps).toBeCloseTo(21, 0); // worked example: about 21 m/s over the ground
    expect(windy.governingReason).toMatch(/faster over the ground/);
    const calm = explainDrop({ massKg: 0.2, heightM: 30, shape: plate });
    expect(calm.impacts.map((i) => [i.id, i.governs])).toEqual([['still-air', true]]);
  });

  it('explains an assessment already computed without recomputing it', () => {
    const drop = assessDrop({ massKg: 1, heightM: 2, contact: { stoppingDistanceM: 0.01 } });
    const explanation = explainDrop(drop);
    expect(explanation.severityBasis).toBe(drop.severity.basis);
    expect(explanation.formulas.map((f) => f.id)).toContain('force-distance');
  });
});
