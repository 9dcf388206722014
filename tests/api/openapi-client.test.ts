/**
 * A client generated from the served OpenAPI document (openapi-typescript) must agree with the
 * shared zod schemas the app itself uses: the test generates the types, then type-checks a small
 * file that passes values both ways between the generated answers and bodies and the shared types.
 * A drift between the document and the schemas (a renamed field, a lost enum, a type gone to
 * `any`) fails the type-check and so the test.
 */
import { execFile } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { promisify } from 'node:util';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type RunningServer, startBuiltServer } from '../support/server.js';

const run = promisify(execFile);
const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), '../..');
const BIN = (name: string) => join(ROOT, 'node_modules/.bin', name);

/**
 * Checked in both directions for answers (what the server sends is what the app parses), from
 * shared to generated for request bodies (what the app builds is what the server accepts).
 */
const CHECK = `
import type { Finding, FindingCreate, FindingListItem, Inspection, InspectionCreate, InspectionDetail, InspectionFinish, ListResponse, MailJobListResponse, Session, SignIn } from '@plummet/shared';
type FindingListResponse = ListResponse<FindingListItem>;
import type { paths } from './openapi.js';

type Json<T> = T extends { content: { 'application/json': infer B } } ? B : never;
type Answer<P extends keyof paths, M extends keyof paths[P], S extends number> = paths[P][M] extends { responses: infer R } ? (S extends keyof R ? Json<R[S]> : never) : never;
type Body<P extends keyof paths, M extends keyof paths[P]> = paths[P][M] extends { requestBody?: infer B } ? Json<NonNullable<B>> : never;
declare function value<T>(): T;

// Answers: generated to shared and back.
export const finding: Finding = value<Answer<'/api/findings/{id}', 'get', 200>>();
export const findingBack: Answer<'/api/findings/{id}', 'get', 200> = value<Finding>();
export const findings: FindingListResponse = value<Answer<'/api/findings', 'get', 200>>();
export const findingsBack: Answer<'/api/findings', 'get', 200> = value<FindingListResponse>();
export const inspection: InspectionDetail = value<Answer<'/api/inspections/{id}', 'get', 200>>();
export const inspectionBack: Answer<'/api/inspections/{id}', 'get', 200> = value<InspectionDetail>();
export const created: Inspection = value<Answer<'/api/inspections', 'post', 201>>();
export const createdBack: Answer<'/api/inspections', 'post', 201> = value<Inspection>();
export const finished: Inspection = value<Answer<'/api/inspections/{id}/finish', 'post', 200>>();
export const session: Session = value<Answer<'/api/auth/sign-in', 'post', 200>>();
export const failedMail: MailJobListResponse = value<Answer<'/api/mail-jobs/failed', 'get', 200>>();
export const failedMailBack: Answer<'/api/mail-jobs/failed', 'get', 200> = value<MailJobListResponse>();

// Bodies: what the app builds with the shared types is what the document accepts.
export const newFinding: Body<'/api/findings', 'post'> = value<FindingCreate>();
export const newInspection: Body<'/api/inspections', 'post'> = value<InspectionCreate>();
export const finish: Body<'/api/inspections/{id}/finish', 'post'> = value<InspectionFinish>();
export const signIn: Body<'/api/auth/sign-in', 'post'> = value<SignIn>();

// The generated types are real types, not \`any\`: a band or a state the schemas do not know is refused.
// @ts-expect-error a risk band that does not exist
export const band: Answer<'/api/findings/{id}', 'get', 200>['riskBand'] = 'Extreme';
// @ts-expect-error a finding state that does not exist
export const state: Answer<'/api/findings/{id}', 'get', 200>['state'] = 'forgotten';
// @ts-expect-error an inspection answer lacks the finding's fields
export const crossed: Finding = value<Answer<'/api/inspections/{id}', 'get', 200>>();
`;

describe('a client generated from the OpenAPI document', () => {
  let server: RunningServer;
  let dir: string;

  beforeAll(async () => {
    server = await startBuiltServer({ seed: false });
    // Inside the repository so '@plummet/shared' resolves; a dot folder, so no other type-check picks it up.
    dir = mkdtempSync(join(ROOT, 'tests', '.openapi-client-'));
  });
  afterAll(async () => {
    await server?.dispose();
    if (dir) rmSync(dir, { recursive: true, force: true });
  });

  it('compiles against the shared types (openapi-typescript, then tsc)', async () => {
    const doc = await (await fetch(`${server.url}/api/docs/openapi.json`)).text();
    writeFileSync(join(dir, 'openapi.json'), doc);
    await run(BIN('openapi-typescript'), [join(dir, 'openapi.json'), '--output', join(dir, 'openapi.d.ts')], {
      cwd: ROOT,
      env: { ...process.env, REDOCLY_TELEMETRY: 'off', REDOCLY_SUPPRESS_UPDATE_NOTICE: 'true' },
    });
    writeFileSync(join(dir, 'check.ts'), CHECK);
    writeFileSync(
      join(dir, 'tsconfig.json'),
      JSON.stringify({ extends: '../../tsconfig.base.json', compilerOptions: { noEmit: true, types: [] }, files: ['check.ts'] }),
    );
    const result = await run(BIN('tsc'), ['-p', join(dir, 'tsconfig.json'), '--pretty', 'false'], { cwd: ROOT }).then(
      () => '',
      (error: { stdout?: string; stderr?: string }) => `${error.stdout ?? ''}${error.stderr ?? ''}`,
    );
    expect(result.split(/\r?\n(?=\S)/).filter((block) => block.trim() !== '')).toEqual([]);
  }, 300_000);
});
