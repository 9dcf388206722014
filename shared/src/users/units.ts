/*
 * A user's unit choices, apart from the schemas (users/user.schema.ts) so that code which only
 * needs the lists or the default wind unit does not build every user schema when it loads.
 */

/** Display units a user can choose; values are always stored and sent in SI. */
export const UNITS_VALUES = ['si', 'imperial'] as const;
export type Units = (typeof UNITS_VALUES)[number];

/**
 * Wind speed has its own unit choice (UK sites give wind in mph while measuring in metres):
 * metres per second, kilometres per hour or miles per hour. Values stay in m/s everywhere else.
 */
export const WIND_UNITS_VALUES = ['mps', 'kmh', 'mph'] as const;
export type WindUnits = (typeof WIND_UNITS_VALUES)[number];

/** The wind unit a user starts with: the one that goes with their display units. */
export const defaultWindUnitsFor = (units: Units): WindUnits => (units === 'imperial' ? 'mph' : 'mps');
