import { describe, expect, it, vi } from 'vitest';

// Replace the integrator with a spy to check that still air never integrates.
vi.mock('./drift.js', async (importOriginal) => {
  const original = await importOriginal<typeof import('./drift.js')>();
  return { ...original, integrateDrift: vi.fn(original.integrateDrift) };
});

const { integrateDrift } = await import('./drift.js');
const { assessDrop } = await import('./assess.js');

describe('drift', () => {
  it('is 0 with no integration when there is no wind or no drag', () => {
    vi.mocked(integrateDrift).mockClear();
    expect(assessDrop({ massKg: 1, heightM: 30, dragAreaM2: 0.02 }).driftM).toBe(0);
    expect(assessDrop({ massKg: 1, heightM: 30, windSpeedMps: 12 }).driftM).toBe(0);
    expect(integrateDrift).not.toHaveBeenCalled();
    assessDrop({ massKg: 1, heightM: 30, dragAreaM2: 0.02, windSpeedMps: 12 });
    expect(integrateDrift).toHaveBeenCalledTimes(1);
  });

  it('carries a very light item at close to the wind speed for its whole fall', () => {
    // 1 g with v_t = 1 m/s from 30 m in a 5 m/s wind: after a short transient it moves with the air,
    // so drift → w × t with t ≈ h / v_t (steady state of the equations of motion).
    const G = 9.80665;
    const result = integrateDrift(30, 0, 1, G, 5, 30);
    expect(result.timeS).toBeCloseTo(30 + 1 / G * Math.log(2), 1); // still-air time h/v_t + (v_t/g) ln 2 (closed form), wind adds no delay at steady state
    expect(result.driftM / result.timeS).toBeGreaterThan(4.9); // mean sideways speed just under w: steady state u = w of dvx/dt = −k|v_rel|(vx − w)
    expect(result.driftM / result.timeS).toBeLessThan(5); // never faster than the wind (same equation: vx rises towards w)
    expect(result.horizontalSpeedMps).toBeCloseTo(5, 6); // steady state: moves with the wind
    expect(result.verticalSpeedMps).toBeCloseTo(1, 6); // steady state: terminal speed relative to the air
  });

  it('grows with the wind and with the height', () => {
    const G = 9.80665;
    const base = integrateDrift(20, 0, 15, G, 5, 2).driftM;
    expect(integrateDrift(20, 0, 15, G, 10, 2).driftM).toBeGreaterThan(base);
    expect(integrateDrift(40, 0, 15, G, 5, 2).driftM).toBeGreaterThan(base);
  });
});
