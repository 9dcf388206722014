/**
 * What "pass" means for each falling-object control, by the site's jurisdiction, with the source
 * beside each line. Shown on the control check screen; the inspector's judgement decides.
 * Paragraph numbers marked "from memory" were recalled, not re-read, when this table was written.
 */
import type { Jurisdiction } from '../sites/jurisdiction.js';
import type { Control } from './control-check.schema.js';

export interface ControlCriterion {
  /** What must be true to pass, in a line. */
  criterion: string;
  /** Where it comes from. */
  source: string;
}

/** UK toe board height, mm (UK practice; BS EN 12811-1 — from memory). */
export const UK_TOE_BOARD_MIN_MM = 150;
/** US toe board height, in (OSHA 29 CFR 1926.451(h)(4)). */
export const US_TOE_BOARD_MIN_IN = 3.5;

export const CONTROL_CRITERIA: Readonly<Record<Control, Readonly<Record<Jurisdiction, ControlCriterion>>>> = {
  'toe-boards': {
    uk: { criterion: `At least ${UK_TOE_BOARD_MIN_MM} mm high at every working edge, secured, no gap at the platform`, source: 'UK WAHR 2005 Sch. 2; 150 mm is UK practice (BS EN 12811-1, from memory)' },
    us: { criterion: `At least ${US_TOE_BOARD_MIN_IN} in (8.9 cm) high along every open edge, secured`, source: 'US OSHA 29 CFR 1926.451(h)(4)' },
  },
  'brick-guards': {
    uk: { criterion: 'Where anything is stacked above the toe board, a brick guard or close boarding up to the guard rail', source: 'UK WAHR 2005 reg. 10' },
    us: { criterion: 'Where anything is piled above the toe board, paneling or screening from toe board to top rail', source: 'US OSHA 29 CFR 1926.451(h)(2)(i) (paragraph from memory)' },
  },
  'netting-or-sheeting': {
    uk: { criterion: 'Netting or sheeting intact, tied in at every tie point, no tears or open laps', source: 'UK WAHR 2005 reg. 10' },
    us: { criterion: 'Debris nets or screens intact and secured where objects could fall on people below', source: 'US OSHA 29 CFR 1926.451(h)(2)(ii) (paragraph from memory)' },
  },
  'fans-or-canopies': {
    uk: { criterion: 'Fans or canopies over walkways and entrances, close boarded and kept clear of debris', source: 'UK WAHR 2005 reg. 10 and reg. 11' },
    us: { criterion: 'Canopy structures or catch platforms over areas where people pass, able to take the falling objects', source: 'US OSHA 29 CFR 1926.451(h)(2)(ii) (paragraph from memory)' },
  },
  'exclusion-zone-barriers': {
    uk: { criterion: 'Danger areas below marked and barriered so that nobody can enter while work goes on above', source: 'UK WAHR 2005 reg. 11' },
    us: { criterion: 'The area below barricaded and people kept out while objects could fall', source: 'US OSHA 29 CFR 1926.451(h)(1) (paragraph from memory)' },
  },
  'tool-tethering': {
    uk: { criterion: 'Hand tools used at the edge tethered or kept in a secured container', source: 'UK WAHR 2005 reg. 10; tethering is common practice, no source' },
    us: { criterion: 'Hand tools used at the edge tethered or kept in a secured container', source: 'US OSHA 29 CFR 1926.451(h)(1); tethering is common practice, no source' },
  },
  'material-storage': {
    uk: { criterion: 'Materials stacked low, away from the edge, within the guards, no loose offcuts', source: 'UK WAHR 2005 reg. 10' },
    us: { criterion: 'Materials no higher than the toe board unless screened, away from the edge', source: 'US OSHA 29 CFR 1926.451(h)(2)(i) (paragraph from memory)' },
  },
  'chutes-and-lowering': {
    uk: { criterion: 'Rubbish goes down a chute or is lowered; nothing is thrown or tipped from height', source: 'UK WAHR 2005 reg. 10' },
    us: { criterion: 'Material dropped more than 20 ft outside the walls goes down an enclosed chute; nothing is thrown', source: 'US OSHA 29 CFR 1926.252(a) (from memory)' },
  },
  'loading-bay-gates': {
    uk: { criterion: 'Loading-bay gate closed except while loading, with no gap at the edge when closed', source: 'UK WAHR 2005 reg. 10 and Sch. 2' },
    us: { criterion: 'Loading-bay gate or guardrail closed except while loading, toe board across the opening', source: 'US OSHA 29 CFR 1926.451(h)' },
  },
  'guardrail-mesh': {
    uk: { criterion: 'Mesh or screening between toe board and guard rail fitted, its openings small enough to stop the items handled', source: 'UK WAHR 2005 reg. 10; opening size is common practice, no source' },
    us: { criterion: 'Screening between toe board and top rail fitted, its openings small enough to stop the items handled', source: 'US OSHA 29 CFR 1926.451(h)' },
  },
};

/** The pass criterion of a control under a jurisdiction. */
export const controlCriterion = (control: Control, jurisdiction: Jurisdiction): ControlCriterion => CONTROL_CRITERIA[control][jurisdiction];
