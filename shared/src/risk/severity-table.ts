/**
 * Severity thresholds as data: the impact energy (J) or peak force (N) at which an estimate reaches
 * each severity level, different for a bare head and a helmet, each with its source. An
 * organisation can pass its own table of the same shape.
 */
import type { Exposure } from '../physics/exposure.js';

export type SeverityLevel = 1 | 2 | 3 | 4 | 5;

/** Generic risk-matrix severity words (product brief). */
export const SEVERITY_LABELS: Readonly<Record<SeverityLevel, string>> = {
  1: 'Negligible',
  2: 'Minor',
  3: 'Moderate',
  4: 'Major',
  5: 'Catastrophic',
};

/** One threshold: at or above `atLeast` (J for energy, N for force) the estimate is at least `level`. */
export interface SeverityThreshold {
  readonly level: 2 | 3 | 4 | 5;
  readonly quantity: 'energy' | 'force';
  /** Joules for energy, newtons for force. */
  readonly atLeast: number;
  /** The reference in words, e.g. "the EN 397 helmet test energy (5 kg from 1 m)". */
  readonly reference: string;
  readonly source: string;
}

export type SeverityTable = Readonly<Record<Exposure, readonly SeverityThreshold[]>>;

const YOGANANDAN = 'Yoganandan et al. 1995, Biomechanics of skull fracture, J Neurotrauma 12(4):659–668';
const EN397 = 'EN 397:2012+A1:2012 Industrial safety helmets, shock absorption test';
const Z891 = 'ANSI/ISEA Z89.1-2014 Type I, force transmission test';
const EN14052 = 'EN 14052:2012 High performance industrial helmets, crown shock absorption';
const NO_SOURCE = 'common practice, no source';

/** Plummet's default table. Energy rules come before force rules of the same level. */
export const DEFAULT_SEVERITY_TABLE: SeverityTable = {
  'bare-head': [
    { level: 2, quantity: 'energy', atLeast: 1.41, reference: 'one tenth of the lowest skull-fracture energy (14.1 J)', source: `${NO_SOURCE} (margin below ${YOGANANDAN})` },
    { level: 2, quantity: 'force', atLeast: 450, reference: 'one tenth of the lowest skull-fracture force (4.5 kN)', source: `${NO_SOURCE} (margin below ${YOGANANDAN})` },
    { level: 3, quantity: 'energy', atLeast: 7.05, reference: 'half the lowest skull-fracture energy (14.1 J)', source: `${NO_SOURCE} (margin below ${YOGANANDAN})` },
    { level: 3, quantity: 'force', atLeast: 2250, reference: 'half the lowest skull-fracture force (4.5 kN)', source: `${NO_SOURCE} (margin below ${YOGANANDAN})` },
    { level: 4, quantity: 'energy', atLeast: 14.1, reference: 'the lowest energy that fractured a skull in cadaver tests (14.1 J)', source: YOGANANDAN },
    { level: 4, quantity: 'force', atLeast: 4500, reference: 'the lowest force that fractured a skull in cadaver tests (4.5 kN)', source: YOGANANDAN },
    { level: 5, quantity: 'energy', atLeast: 68.5, reference: 'the highest skull-fracture energy in cadaver tests (68.5 J): above it every skull tested fractured', source: YOGANANDAN },
    { level: 5, quantity: 'force', atLeast: 14100, reference: 'the highest skull-fracture force in cadaver tests (14.1 kN): above it every skull tested fractured', source: YOGANANDAN },
  ],
  helmet: [
    { level: 2, quantity: 'energy', atLeast: 24.5, reference: 'half the EN 397 helmet test energy (49 J)', source: `${NO_SOURCE} (margin below ${EN397})` },
    { level: 2, quantity: 'force', atLeast: 2500, reference: 'half the EN 397 transmitted-force limit (5.0 kN)', source: `${NO_SOURCE} (margin below ${EN397})` },
    { level: 3, quantity: 'energy', atLeast: 49.0, reference: 'the EN 397 helmet test energy (5 kg from 1 m, 49 J): beyond what an industrial helmet is tested to', source: EN397 },
    { level: 3, quantity: 'force', atLeast: 4450, reference: 'the ANSI/ISEA Z89.1 Type I transmitted-force limit (4450 N)', source: Z891 },
    { level: 4, quantity: 'energy', atLeast: 54.5, reference: 'the ANSI/ISEA Z89.1 Type I test energy (3.6 kg at 5.5 m/s, 54.5 J): beyond both industrial helmet tests', source: Z891 },
    { level: 4, quantity: 'force', atLeast: 5000, reference: 'the EN 397 transmitted-force limit (5.0 kN): beyond both helmet limits and above the lowest skull-fracture force (4.5 kN)', source: `${EN397}; ${YOGANANDAN}` },
    { level: 5, quantity: 'energy', atLeast: 100, reference: 'the EN 14052 high-performance helmet crown test energy (100 J): beyond any industrial helmet test', source: EN14052 },
    { level: 5, quantity: 'force', atLeast: 14100, reference: 'the highest skull-fracture force in cadaver tests (14.1 kN)', source: YOGANANDAN },
  ],
};
