import { Inject, Injectable } from '@nestjs/common';
import { eq, sql } from 'drizzle-orm';
import type { Units } from '@plummet/shared';
import { DRIZZLE, type Db } from '../db/db.tokens.js';
import { memberships, scaffolds, sites, users } from '../db/schema/index.js';

/** The names an export writes beside the ids: small per organisation, read once per export. */
@Injectable()
export class FindingsExportRepository {
  constructor(@Inject(DRIZZLE) private readonly db: Db) {}

  async scaffoldNames(organisationId: string): Promise<Map<string, { reference: string; siteName: string }>> {
    const rows = await this.db
      .select({ id: scaffolds.id, reference: scaffolds.reference, siteName: sites.name })
      .from(scaffolds)
      .innerJoin(sites, eq(sites.id, scaffolds.siteId))
      .where(eq(scaffolds.organisationId, organisationId));
    return new Map(rows.map((r) => [r.id, { reference: r.reference, siteName: r.siteName }]));
  }

  async memberNames(organisationId: string): Promise<Map<string, string>> {
    const rows = await this.db
      .select({ id: users.id, name: users.name })
      .from(users)
      .innerJoin(memberships, eq(memberships.userId, users.id))
      .where(eq(memberships.organisationId, organisationId));
    return new Map(rows.map((r) => [r.id, r.name]));
  }

  async units(userId: string): Promise<Units> {
    const [row] = await this.db.select({ units: users.units }).from(users).where(sql`${users.id} = ${userId}`);
    return row?.units ?? 'si';
  }
}
