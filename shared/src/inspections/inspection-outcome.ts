/**
 * The outcome of an inspection, recorded when it is signed: the tag status the inspector gives the
 * scaffold, the restriction in words when its use is limited, and whether the tags at every access
 * point were changed to match. The app records what a competent person decided; it never decides.
 */
import { z } from 'zod';
import { LIMITS } from '../common/fields.schema.js';
import { type ScaffoldStatus, ScaffoldStatusSchema, scaffoldStatusWords } from '../scaffolds/scaffold.schema.js';

/**
 * Fields of the finish body. They default to "not recorded" so a signed report queued on a phone
 * before the outcome was asked for still reaches the server; today's phone always sends them.
 */
export const inspectionOutcomeFields = {
  tagStatus: ScaffoldStatusSchema.nullable().default(null),
  /** Which lifts and bays, what load: required when the status is `limited`. */
  restriction: z.string().trim().max(LIMITS.noteMax).default(''),
  accessTagsChanged: z.boolean().nullable().default(null),
};

export interface InspectionOutcome {
  tagStatus: ScaffoldStatus | null;
  restriction: string;
  accessTagsChanged: boolean | null;
}

/** A limited status needs its restriction in words; a given status needs the answer about the tags. */
export function refineInspectionOutcome(value: InspectionOutcome, ctx: z.RefinementCtx): void {
  if (value.tagStatus === 'limited' && value.restriction.trim() === '') {
    ctx.addIssue({ code: 'custom', path: ['restriction'], message: 'Say what the limit is: which lifts and bays, what load' });
  }
  if (value.tagStatus !== null && value.accessTagsChanged === null) {
    ctx.addIssue({ code: 'custom', path: ['accessTagsChanged'], message: 'Say whether the tags at every access point were changed' });
  }
}

/** What the finish step asks the inspector to look at again before signing (nothing is refused). */
export interface OutcomePrompt {
  code: 'open-high-on-cleared' | 'tags-not-changed';
  message: string;
}

/**
 * Prompts for an outcome: a scaffold recorded `cleared` while a High finding is still open on it
 * (the inspector is asked to record `limited` or `closed`, or to deal with the finding first), and
 * tags at the access points left showing something other than the recorded status.
 */
export function outcomePrompts(outcome: Pick<InspectionOutcome, 'tagStatus' | 'accessTagsChanged'>, openHighFindings: number): OutcomePrompt[] {
  const prompts: OutcomePrompt[] = [];
  if (outcome.tagStatus === 'cleared' && openHighFindings > 0) {
    prompts.push({
      code: 'open-high-on-cleared',
      message: `${openHighFindings === 1 ? 'A High finding is' : `${openHighFindings} High findings are`} still open on this scaffold: record ${scaffoldStatusWords('limited')} or ${scaffoldStatusWords('closed')} unless it has been dealt with.`,
    });
  }
  if (outcome.tagStatus !== null && outcome.accessTagsChanged === false) {
    prompts.push({
      code: 'tags-not-changed',
      message: 'The tags at the access points still show something else: change every one before leaving, or say why in the report.',
    });
  }
  return prompts;
}

/** The reason of an inspection in words, for reports and e-mails (InspectionReason codes). */
export const INSPECTION_REASON_WORDS: Readonly<Record<string, string>> = {
  handover: 'Handover after erection, before first use',
  scheduled: 'Scheduled inspection',
  'after-alteration': 'After an alteration',
  'after-bad-weather': 'After adverse weather',
  'pre-shift': 'Before the shift',
};

/** The outcome in words for reports and e-mails. */
export function outcomeWords(outcome: InspectionOutcome): { status: string; restriction: string | null; tags: string } {
  return {
    status: outcome.tagStatus ? scaffoldStatusWords(outcome.tagStatus) : 'Not recorded',
    restriction: outcome.tagStatus === 'limited' ? outcome.restriction : null,
    tags:
      outcome.accessTagsChanged === null
        ? 'Not recorded'
        : outcome.accessTagsChanged
          ? 'Changed at every access point'
          : 'Not changed at every access point',
  };
}
