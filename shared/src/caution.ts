/**
 * The caution every estimate screen, report and e-mail carries (product brief, "Safety stance").
 */
export const CAUTION_TEXT =
  'Estimates are for prioritising only. They use simplified physics and published test values; ' +
  'local regulations, site rules and the judgement of a competent person prevail.';
