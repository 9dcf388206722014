/** The setting-up routes: sites, scaffolds, members and invitations, organisation settings, own catalogue items. */
import {
  CatalogueItemSchema,
  ForemanListResponseSchema,
  MemberListResponseSchema,
  MemberSchema,
  OrganisationSettingsSchema,
  ScaffoldSchema,
  SiteSchema,
  type CatalogueItem,
  type CatalogueItemCreate,
  type CatalogueItemUpdate,
  type Foreman,
  type InvitationCreate,
  type Member,
  type MemberUpdate,
  type OrganisationSettings,
  type OrganisationSettingsUpdate,
  type Scaffold,
  type ScaffoldCreate,
  type ScaffoldUpdate,
  type Site,
  type SiteCreate,
  type SiteUpdate,
} from '@plummet/shared';
import { fetchAllPages } from '../../api/all-pages';
import { authorisedFetch } from '../../api/authorised-fetch';

export async function fetchSite(id: string): Promise<Site> {
  return SiteSchema.parse(await authorisedFetch(`/sites/${id}`));
}
export async function createSite(body: SiteCreate): Promise<Site> {
  return SiteSchema.parse(await authorisedFetch('/sites', { method: 'POST', body }));
}
export async function updateSite(id: string, body: SiteUpdate): Promise<Site> {
  return SiteSchema.parse(await authorisedFetch(`/sites/${id}`, { method: 'PATCH', body }));
}

export async function fetchScaffold(id: string): Promise<Scaffold> {
  return ScaffoldSchema.parse(await authorisedFetch(`/scaffolds/${id}`));
}
export async function createScaffold(body: ScaffoldCreate): Promise<Scaffold> {
  return ScaffoldSchema.parse(await authorisedFetch('/scaffolds', { method: 'POST', body }));
}
export async function updateScaffold(id: string, body: ScaffoldUpdate): Promise<Scaffold> {
  return ScaffoldSchema.parse(await authorisedFetch(`/scaffolds/${id}`, { method: 'PATCH', body }));
}
export async function archiveScaffold(id: string): Promise<Scaffold> {
  return ScaffoldSchema.parse(await authorisedFetch(`/scaffolds/${id}/archive`, { method: 'POST' }));
}

/** Active foremen, for "who looks after this scaffold". */
export async function fetchForemen(): Promise<Foreman[]> {
  return ForemanListResponseSchema.parse(await authorisedFetch('/users/foremen')).items;
}

export function fetchOrganisationMembers(): Promise<Member[]> {
  return fetchAllPages<Member>('/users', { sort: 'name', order: 'asc' }, MemberListResponseSchema);
}
/** Invites someone, or renews a pending invitation with a fresh link (the same route sends it again). */
export async function inviteMember(body: InvitationCreate): Promise<Member> {
  return MemberSchema.parse(await authorisedFetch('/users/invitations', { method: 'POST', body }));
}
export async function updateMember(id: string, body: MemberUpdate): Promise<Member> {
  return MemberSchema.parse(await authorisedFetch(`/users/${id}`, { method: 'PATCH', body }));
}

export async function fetchOrganisationSettings(): Promise<OrganisationSettings> {
  return OrganisationSettingsSchema.parse(await authorisedFetch('/organisation/settings'));
}
export async function updateOrganisationSettings(body: OrganisationSettingsUpdate): Promise<OrganisationSettings> {
  return OrganisationSettingsSchema.parse(await authorisedFetch('/organisation/settings', { method: 'PATCH', body }));
}

export async function createCatalogueItem(body: CatalogueItemCreate): Promise<CatalogueItem> {
  return CatalogueItemSchema.parse(await authorisedFetch('/catalogue', { method: 'POST', body }));
}
export async function updateCatalogueItem(id: string, body: CatalogueItemUpdate): Promise<CatalogueItem> {
  return CatalogueItemSchema.parse(await authorisedFetch(`/catalogue/${id}`, { method: 'PATCH', body }));
}
export async function deleteCatalogueItem(id: string): Promise<void> {
  await authorisedFetch(`/catalogue/${id}`, { method: 'DELETE' });
}
