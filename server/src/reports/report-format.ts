import { FINDING_STATE_WORDS, type FindingState, joulesToFootPounds, LIKELIHOOD_LABELS, type LikelihoodLevel, metresToFeet, SEVERITY_LABELS, type SeverityLevel } from '@plummet/shared';
import type { ReportFinding } from './report-data.js';

export type Units = 'si' | 'imperial';

/** Values are stored in SI; the organisation's units are applied only here, at the edge. */
export function length(metres: number, units: Units): string {
  return units === 'imperial' ? `${metresToFeet(metres).toFixed(1)} ft` : `${metres.toFixed(1)} m`;
}

export function energy(joules: number, units: Units): string {
  return units === 'imperial' ? `${joulesToFootPounds(joules).toFixed(0)} ft·lbf` : `${joules.toFixed(0)} J`;
}

/** A date and time in the organisation's zone, e.g. "2 Dec 2026, 07:15 (Europe/London)". */
export function dateTime(at: Date | null, timeZone: string): string {
  if (!at) return 'not recorded';
  const text = new Intl.DateTimeFormat('en-GB', { timeZone, day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' }).format(at);
  return `${text} (${timeZone})`;
}

export function dateOnly(at: Date, timeZone: string): string {
  return new Intl.DateTimeFormat('en-GB', { timeZone, day: 'numeric', month: 'short', year: 'numeric' }).format(at);
}

export function position(f: ReportFinding, units: Units): string {
  return `${f.row.elevation} elevation, lift ${f.row.lift}, bay ${f.row.bay}, ${length(f.row.heightM, units)} up`;
}

export function severityWord(f: ReportFinding): string {
  return SEVERITY_LABELS[f.row.severity as SeverityLevel] ?? `level ${f.row.severity}`;
}

export function likelihoodWord(f: ReportFinding): string {
  return LIKELIHOOD_LABELS[f.row.likelihood as LikelihoodLevel] ?? `level ${f.row.likelihood}`;
}

export function impactEnergyJ(f: ReportFinding): number {
  return (f.row.estimate as { impactEnergyJ?: number }).impactEnergyJ ?? 0;
}

export const stateWord = (state: string): string => FINDING_STATE_WORDS[state as FindingState] ?? state;

/** One line per field, the same words in the PDF, the HTML and the plain text. */
export function findingFacts(f: ReportFinding, units: Units, timeZone: string): [string, string][] {
  return [
    ['Position', position(f, units)],
    ['Risk', `${f.row.riskBand} (score ${f.row.riskScore})`],
    ['Impact energy (estimate)', energy(impactEnergyJ(f), units)],
    ['Severity', severityWord(f)],
    ['Likelihood', likelihoodWord(f)],
    ['State', stateWord(f.row.state)],
    ['Assigned to', f.assignee ? f.assignee.name : 'not assigned'],
    ['Due', f.row.dueAt ? dateTime(f.row.dueAt, timeZone) : 'no due time set'],
  ];
}
