import { useQuery, useQueryClient } from '@tanstack/react-query';
import { fetchCatalogue } from '../catalogue/catalogue.api';
import { managerKeys, useScaffolds, useSites } from '../manager/manager.queries';
import { fetchForemen, fetchOrganisationMembers, fetchOrganisationSettings, fetchScaffold, fetchSite } from './setup.api';

/** Key factory of the setting-up screens (online only: these screens change the server's records). */
export const setupKeys = {
  all: ['setup'] as const,
  site: (id: string) => [...setupKeys.all, 'site', id] as const,
  scaffold: (id: string) => [...setupKeys.all, 'scaffold', id] as const,
  foremen: () => [...setupKeys.all, 'foremen'] as const,
  members: () => [...setupKeys.all, 'members'] as const,
  settings: () => [...setupKeys.all, 'settings'] as const,
  catalogue: () => [...setupKeys.all, 'catalogue'] as const,
};

export { useScaffolds, useSites };
export const useSite = (id: string | undefined) => useQuery({ queryKey: setupKeys.site(id ?? ''), queryFn: () => fetchSite(id!), enabled: !!id });
export const useScaffoldToEdit = (id: string | undefined) =>
  useQuery({ queryKey: setupKeys.scaffold(id ?? ''), queryFn: () => fetchScaffold(id!), enabled: !!id });
export const useForemen = () => useQuery({ queryKey: setupKeys.foremen(), queryFn: fetchForemen, staleTime: 60_000 });
export const useOrganisationMembers = () => useQuery({ queryKey: setupKeys.members(), queryFn: fetchOrganisationMembers });
export const useOrganisationSettings = () => useQuery({ queryKey: setupKeys.settings(), queryFn: fetchOrganisationSettings });
export const useCatalogueItems = () => useQuery({ queryKey: setupKeys.catalogue(), queryFn: () => fetchCatalogue() });

/** After a change: the setting-up screens and every manager figure may have moved. */
export function useRefreshSetup() {
  const client = useQueryClient();
  return () => Promise.all([client.invalidateQueries({ queryKey: setupKeys.all }), client.invalidateQueries({ queryKey: managerKeys.all })]);
}
