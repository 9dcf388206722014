import { INSPECTION_REASON_WORDS, outcomeWords } from '@plummet/shared';
import type { inspections } from '../db/schema/index.js';

/**
 * Why the inspection was made and what it recorded on the tag, as label and value pairs for the
 * signed report and its e-mail: the reason, the tag status given, the restriction when limited, and
 * whether the tags at every access point were changed.
 */
export function outcomeLines(inspection: typeof inspections.$inferSelect): [string, string][] {
  const words = outcomeWords(inspection);
  const lines: [string, string][] = [
    ['Reason for the inspection', INSPECTION_REASON_WORDS[inspection.reason] ?? inspection.reason],
    ['Tag status recorded by the inspector', words.status],
  ];
  if (words.restriction !== null) lines.push(['Restriction', words.restriction]);
  lines.push(['Tags at the access points', words.tags]);
  return lines;
}
