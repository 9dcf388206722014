import { joulesToFootPounds, metresToFeet } from '@plummet/shared';
import type { Units } from '../../lib/units';

/** Figures arrive in SI; they are converted for the screen here only. */
export const formatHeight = (m: number, units: Units) => (units === 'imperial' ? `${metresToFeet(m).toFixed(1)} ft` : `${m.toFixed(1)} m`);
export const formatEnergy = (j: number, units: Units) => (units === 'imperial' ? `${joulesToFootPounds(j).toFixed(0)} ft·lbf` : `${j.toFixed(0)} J`);
