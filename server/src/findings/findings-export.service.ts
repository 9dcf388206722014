import { Injectable } from '@nestjs/common';
import {
  csvLine,
  type FindingExportQuery,
  type FindingListQuery,
  joulesToFootPounds,
  kilogramsToPounds,
  metresToFeet,
  type Units,
} from '@plummet/shared';
import type { AuthUser } from '../auth/auth.types.js';
import type { ExportFinding } from './finding.mapper.js';
import { FindingsExportRepository } from './findings-export.repository.js';
import { FindingsService } from './findings.service.js';

/** Rows read per round trip: the export holds one batch in memory at a time, whatever the total. */
export const EXPORT_BATCH = 500;

const round = (value: number, digits: number) => Number(value.toFixed(digits));

/** The header row: units in the headings, in the user's units. */
export function exportHeader(units: Units): string[] {
  const imperial = units === 'imperial';
  return [
    'Finding id', 'Site', 'Scaffold', 'Elevation', 'Lift', 'Bay',
    imperial ? 'Height (ft)' : 'Height (m)', 'Item', imperial ? 'Mass (lb)' : 'Mass (kg)', 'Exposure',
    imperial ? 'Impact energy (ft·lbf)' : 'Impact energy (J)', 'Severity', 'Likelihood', 'Risk score', 'Band', 'State',
    'Assignee', 'Due (UTC)', 'Overdue', 'Raised (UTC)', 'Notes',
  ];
}

export interface ExportNames {
  scaffolds: Map<string, { reference: string; siteName: string }>;
  members: Map<string, string>;
}

/** One finding as a CSV row; figures converted from SI at this edge only. */
export function exportRow(f: ExportFinding, units: Units, names: ExportNames): (string | number | boolean | null)[] {
  const imperial = units === 'imperial';
  const scaffold = names.scaffolds.get(f.scaffoldId);
  return [
    f.id, scaffold?.siteName ?? '', scaffold?.reference ?? '', f.elevation, f.lift, f.bay,
    round(imperial ? metresToFeet(f.heightM) : f.heightM, 2), f.itemName,
    round(imperial ? kilogramsToPounds(f.massKg) : f.massKg, 3), f.exposure,
    round(imperial ? joulesToFootPounds(f.impactEnergyJ) : f.impactEnergyJ, 1),
    f.severity, f.likelihood, f.riskScore, f.riskBand, f.state,
    f.assigneeId ? (names.members.get(f.assigneeId) ?? '') : '', f.dueAt, f.overdue, f.createdAt, f.notes,
  ];
}

@Injectable()
export class FindingsExportService {
  constructor(
    private readonly findings: FindingsService,
    private readonly lookups: FindingsExportRepository,
  ) {}

  /**
   * The CSV in chunks: the header, then one chunk per keyset batch of the list query (same filters,
   * same sort, same scope), so memory stays flat for any number of findings.
   */
  async *csv(user: AuthUser, query: FindingExportQuery): AsyncGenerator<string> {
    const [units, scaffolds, members] = await Promise.all([
      this.lookups.units(user.userId),
      this.lookups.scaffoldNames(user.organisationId),
      this.lookups.memberNames(user.organisationId),
    ]);
    const names = { scaffolds, members };
    yield csvLine(exportHeader(units));
    let cursor: string | undefined;
    do {
      const listQuery: FindingListQuery = { ...query, limit: EXPORT_BATCH, cursor, estimate: 'full' };
      const page = await this.findings.exportPage(user, listQuery);
      yield page.items.map((f) => csvLine(exportRow(f, units, names))).join('');
      cursor = page.nextCursor ?? undefined;
    } while (cursor);
  }
}
