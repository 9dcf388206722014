import { type ExclusionZone, type ExclusionZoneList, ExclusionZoneListSchema, type ExclusionZonePut, ExclusionZoneSchema } from '@plummet/shared';
import { authorisedFetch } from '../../api/authorised-fetch';

/** `GET /api/scaffolds/:id/exclusion-zones`: the zone below each elevation, with its suggestion. */
export async function fetchExclusionZones(scaffoldId: string): Promise<ExclusionZoneList> {
  return ExclusionZoneListSchema.parse(await authorisedFetch(`/scaffolds/${scaffoldId}/exclusion-zones`));
}

/** `PUT /api/scaffolds/:id/exclusion-zones/:elevation`: the heaviest item, the limiting wind and the width barriered. */
export async function putExclusionZone(scaffoldId: string, elevation: string, body: ExclusionZonePut): Promise<ExclusionZone> {
  return ExclusionZoneSchema.parse(
    await authorisedFetch(`/scaffolds/${scaffoldId}/exclusion-zones/${encodeURIComponent(elevation)}`, { method: 'PUT', body }),
  );
}
