import { Inject, Injectable } from '@nestjs/common';
import type { WindUnits } from '@plummet/shared';
import { eq, sql } from 'drizzle-orm';
import { DRIZZLE, type Db, type DbExecutor } from '../db/db.tokens.js';
import { users } from '../db/schema/index.js';

export interface UserSettingsRow {
  name: string;
  position: string;
  units: 'si' | 'imperial';
  windUnits: WindUnits;
  version: number;
  syncFields: unknown;
}

export type UserSettingsChanges = Partial<Pick<UserSettingsRow, 'name' | 'position' | 'units' | 'windUnits'>> & { syncFields: unknown };

/** The user's own profile and settings with their per-field stamps (user-settings-commands.ts). */
@Injectable()
export class UserSettingsRepository {
  constructor(@Inject(DRIZZLE) private readonly db: Db) {}

  async lock(userId: string, executor: DbExecutor = this.db): Promise<UserSettingsRow | undefined> {
    const [row] = await executor
      .select({ name: users.name, position: users.position, units: users.units, windUnits: users.windUnits, version: users.version, syncFields: users.syncFields })
      .from(users)
      .where(eq(users.id, userId))
      .for('update');
    return row;
  }

  async update(userId: string, changes: UserSettingsChanges, executor: DbExecutor = this.db): Promise<void> {
    await executor
      .update(users)
      .set({ ...changes, version: sql`${users.version} + 1` })
      .where(eq(users.id, userId));
  }
}
