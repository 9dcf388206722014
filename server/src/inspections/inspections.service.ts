import { Inject, Injectable } from '@nestjs/common';
import {
  type Control,
  type ControlCheck,
  type ControlCheckPut,
  type Inspection,
  type InspectionCreate,
  type InspectionDetail,
  type InspectionFinish,
  type InspectionListQuery,
  type InspectionUpdate,
  type ListResponse,
} from '@plummet/shared';
import type { AuthUser } from '../auth/auth.types.js';
import { AppError } from '../common/app-error.js';
import { scopedForeman } from '../common/foreman-scope.js';
import { toPage } from '../common/keyset.js';
import { DRIZZLE, type Db } from '../db/db.tokens.js';
import { ScaffoldsRepository } from '../scaffolds/scaffolds.repository.js';
import { InspectionCommands } from './inspection-commands.js';
import { toControlCheck, toInspection } from './inspection.mapper.js';
import { InspectionsRepository } from './inspections.repository.js';

@Injectable()
export class InspectionsService {
  constructor(
    @Inject(DRIZZLE) private readonly db: Db,
    private readonly inspections: InspectionsRepository,
    private readonly scaffolds: ScaffoldsRepository,
    private readonly commands: InspectionCommands,
  ) {}

  async list(user: AuthUser, query: InspectionListQuery): Promise<ListResponse<Inspection>> {
    const rows = await this.inspections.list(user.organisationId, query, scopedForeman(user));
    return toPage(
      rows.map((r) => ({ ...r.row, sortKey: r.sortKey })),
      query,
      toInspection,
    );
  }

  async get(user: AuthUser, id: string): Promise<InspectionDetail> {
    const row = await this.inspections.find(user.organisationId, id);
    const foremanId = scopedForeman(user);
    if (!row || (foremanId && !(await this.scaffolds.inForemanScope(row.scaffoldId, foremanId)))) throw AppError.notFound('Inspection');
    const checks = await this.inspections.controlChecks(id);
    return { ...toInspection(row), controlChecks: checks.map(toControlCheck) };
  }

  /**
   * Idempotent by the phone's id: the same body again answers the stored inspection
   * (`created: false`); the id with another body is a conflict; another organisation's id is 404.
   * Every write below runs the one command layer (inspection-commands.ts), as sync push does.
   */
  async create(user: AuthUser, input: InspectionCreate): Promise<{ inspection: Inspection; created: boolean }> {
    const result = await this.db.transaction((tx) => this.commands.create(tx, restActor(user), input));
    return { inspection: toInspection(result.row), created: result.created };
  }

  async update(user: AuthUser, id: string, input: InspectionUpdate): Promise<Inspection> {
    return toInspection((await this.db.transaction((tx) => this.commands.edit(tx, restActor(user), id, input))).row);
  }

  /** Signs off the statutory report (and queues its e-mail in the same transaction). */
  async finish(user: AuthUser, id: string, input: InspectionFinish): Promise<Inspection> {
    return toInspection((await this.db.transaction((tx) => this.commands.finish(tx, restActor(user), id, input))).row);
  }

  async putControlCheck(user: AuthUser, id: string, control: Control, input: ControlCheckPut): Promise<ControlCheck> {
    const payload = { inspectionId: id, control, ...input };
    return toControlCheck((await this.db.transaction((tx) => this.commands.putControlCheck(tx, restActor(user), undefined, payload))).row);
  }
}

const restActor = (user: AuthUser) => ({ user, clientId: null, mutationId: null });
