import { Inject, Injectable } from '@nestjs/common';
import { eq } from 'drizzle-orm';
import { DRIZZLE, type Db, type DbExecutor } from '../db/db.tokens.js';
import { organisations } from '../db/schema/index.js';

@Injectable()
export class OrganisationsRepository {
  constructor(@Inject(DRIZZLE) private readonly db: Db) {}

  /** The stored settings (jsonb, unvalidated); `forUpdate` locks the organisation row. */
  async settings(organisationId: string, executor: DbExecutor = this.db, forUpdate = false): Promise<unknown> {
    const q = executor.select({ settings: organisations.settings }).from(organisations).where(eq(organisations.id, organisationId));
    const [row] = forUpdate ? await q.for('update') : await q;
    return row?.settings;
  }

  async saveSettings(organisationId: string, settings: Record<string, unknown>, executor: DbExecutor = this.db): Promise<void> {
    await executor.update(organisations).set({ settings }).where(eq(organisations.id, organisationId));
  }
}
