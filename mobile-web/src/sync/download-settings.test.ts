import 'fake-indexeddb/auto';
import { DEFAULT_ORGANISATION_SETTINGS } from '@plummet/shared';
import { afterEach, describe, expect, it } from 'vitest';
import { readMeta } from '../local-db/db';
import { dropTestDatabases, freshDb } from '../local-db/testing';
import { downloadOrganisationSettings, ORGANISATION_SETTINGS_META_KEY } from './download-settings';

afterEach(dropTestDatabases);

const answering = (status: number, body: unknown) => async () => new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });

describe("keeping the organisation's settings on the phone", () => {
  it('stores what the server answers, so the fix loop follows the organisation offline', async () => {
    const database = freshDb();
    const settings = { ...DEFAULT_ORGANISATION_SETTINGS, proofPhotoRequiredForHigh: false, fixDueHours: { High: 8, Medium: 48 } };
    expect(await downloadOrganisationSettings(database, answering(200, settings))).toBe(true);
    expect(await readMeta(database, ORGANISATION_SETTINGS_META_KEY)).toMatchObject({ proofPhotoRequiredForHigh: false, fixDueHours: { High: 8, Medium: 48 } });
  });

  it('keeps the last copy when the server refuses or answers something it cannot read', async () => {
    const database = freshDb();
    await downloadOrganisationSettings(database, answering(200, { ...DEFAULT_ORGANISATION_SETTINGS, digestHour: 7 }));
    expect(await downloadOrganisationSettings(database, answering(503, { code: 'SERVICE_UNAVAILABLE' }))).toBe(false);
    expect(await downloadOrganisationSettings(database, answering(200, { digestHour: 99 }))).toBe(false);
    expect(await readMeta(database, ORGANISATION_SETTINGS_META_KEY)).toMatchObject({ digestHour: 7 });
  });
});
