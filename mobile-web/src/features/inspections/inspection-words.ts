import { CONTROL_LABELS, type Control, type ControlResult, type InspectionReason } from '@plummet/shared';

export const REASON_WORDS: Record<InspectionReason, { label: string; hint: string }> = {
  scheduled: { label: 'Scheduled', hint: 'The regular inspection of the site’s regime' },
  'after-alteration': { label: 'After an alteration', hint: 'Something was added, removed or changed' },
  'after-bad-weather': { label: 'After bad weather', hint: 'Storm, high wind or heavy snow' },
  handover: { label: 'Handover', hint: 'After erection, before first use, or taking over from another firm' },
  'pre-shift': { label: 'Before the shift', hint: 'The check before each shift (US OSHA 29 CFR 1926.451(f)(3))' },
};

/** The falling-object controls, in the trade's words with what to look for. */
export const CONTROL_WORDS: Record<Control, { label: string; lookFor: string }> = {
  'toe-boards': { label: CONTROL_LABELS['toe-boards'], lookFor: 'Fitted on every working lift, no gaps, secured' },
  'brick-guards': { label: CONTROL_LABELS['brick-guards'], lookFor: 'Where materials are stacked above the toe board' },
  'netting-or-sheeting': { label: CONTROL_LABELS['netting-or-sheeting'], lookFor: 'Intact, tied in, no tears or open laps' },
  'fans-or-canopies': { label: CONTROL_LABELS['fans-or-canopies'], lookFor: 'Over walkways and entrances, boarded and clear' },
  'exclusion-zone-barriers': { label: CONTROL_LABELS['exclusion-zone-barriers'], lookFor: 'Barriers and signs keep people out below' },
  'tool-tethering': { label: CONTROL_LABELS['tool-tethering'], lookFor: 'Hand tools at height are tethered' },
  'material-storage': { label: CONTROL_LABELS['material-storage'], lookFor: 'Stacked low, away from the edge, within guards' },
  'chutes-and-lowering': { label: CONTROL_LABELS['chutes-and-lowering'], lookFor: 'Waste goes down a chute or is lowered, never thrown or tipped' },
  'loading-bay-gates': { label: CONTROL_LABELS['loading-bay-gates'], lookFor: 'Closed except while loading, no gap at the edge' },
  'guardrail-mesh': { label: CONTROL_LABELS['guardrail-mesh'], lookFor: 'Fitted toe board to rail, openings small enough for what is handled' },
};

/** A control check's result, as the inspector chooses it. */
export const RESULT_WORDS: Record<ControlResult, string> = { pass: 'Pass', fail: 'Fail', 'not-applicable': 'Not applicable' };
