import { lazy, Suspense, type ComponentType, type LazyExoticComponent } from 'react';
import { buildSchemasInSteps, SYNC_SCHEMAS } from '../api/building-schemas';

/**
 * Every page loads on demand, so the first download holds only the shell (React, Ionic, the
 * router); Dexie, zod and the physics come with the first page that needs them. The service
 * worker precaches every chunk, so pages still open with no signal.
 */
function page<K extends string>(load: () => Promise<Record<K, ComponentType>>, name: K): LazyExoticComponent<ComponentType> {
  return lazy(() => load().then((module) => ({ default: module[name] })));
}

export const HomePage = page(() => import('../features/home/pages/HomePage'), 'HomePage');
export const SignInPage = page(() => import('../features/auth/pages/SignInPage'), 'SignInPage');
export const SitePage = page(() => import('../features/sites/pages/SitePage'), 'SitePage');
export const FindingListPage = page(() => import('../features/findings/pages/FindingListPage'), 'FindingListPage');
export const ScaffoldPage = page(() => import('../features/scaffolds/pages/ScaffoldPage'), 'ScaffoldPage');
export const InspectionPage = page(() => import('../features/inspections/pages/InspectionPage'), 'InspectionPage');
export const InspectionFinishPage = page(() => import('../features/inspections/pages/InspectionFinishPage'), 'InspectionFinishPage');
export const FindingEditorPage = page(() => import('../features/findings/pages/FindingEditorPage'), 'FindingEditorPage');
export const CalculatorPage = page(() => import('../features/calculator/pages/CalculatorPage'), 'CalculatorPage');
export const SettingsPage = page(() => import('../features/settings/pages/SettingsPage'), 'SettingsPage');
export const SyncStatusPage = page(() => import('../features/sync/pages/SyncStatusPage'), 'SyncStatusPage');
export const FixListPage = page(() => import('../features/fix-loop/pages/FixListPage'), 'FixListPage');
export const FixPage = page(() => import('../features/fix-loop/pages/FixPage'), 'FixPage');
export const ShiftPage = page(() => import('../features/fix-loop/pages/ShiftPage'), 'ShiftPage');
export const ToVerifyPage = page(() => import('../features/fix-loop/pages/ToVerifyPage'), 'ToVerifyPage');
export const OverviewPage = page(() => import('../features/manager/pages/OverviewPage'), 'OverviewPage');
export const FindingsTablePage = page(() => import('../features/manager/pages/FindingsTablePage'), 'FindingsTablePage');
export const ManagerFindingPage = page(() => import('../features/manager/pages/ManagerFindingPage'), 'ManagerFindingPage');
export const TrendsPage = page(() => import('../features/manager/pages/TrendsPage'), 'TrendsPage');
export const ReportsPage = page(() => import('../features/manager/pages/ReportsPage'), 'ReportsPage');
export const AcceptInvitePage = page(() => import('../features/auth/pages/AcceptInvitePage'), 'AcceptInvitePage');
export const SitesSetupPage = page(() => import('../features/setup/pages/SitesSetupPage'), 'SitesSetupPage');
export const SiteFormPage = page(() => import('../features/setup/pages/SiteFormPage'), 'SiteFormPage');
export const ScaffoldFormPage = page(() => import('../features/setup/pages/ScaffoldFormPage'), 'ScaffoldFormPage');
export const PeoplePage = page(() => import('../features/setup/pages/PeoplePage'), 'PeoplePage');
export const OrganisationSettingsPage = page(() => import('../features/setup/pages/OrganisationSettingsPage'), 'OrganisationSettingsPage');
export const CatalogueSetupPage = page(() => import('../features/setup/pages/CatalogueSetupPage'), 'CatalogueSetupPage');
export const FailedMailPage = page(() => import('../features/manager/pages/FailedMailPage'), 'FailedMailPage');
/**
 * Not a page: runs the sync engine while someone is signed in (it needs the local database, so it
 * loads on demand too), after the schemas it checks with, built a few at a time.
 */
export const SyncRunner = page(() => buildSchemasInSteps(SYNC_SCHEMAS).then(() => import('./SyncRunner')), 'SyncRunner');

/** A route's element: the lazy page, rendering nothing until its chunk has loaded (Ionic waits for the IonPage). */
export function Lazy({ page: Page }: { page: LazyExoticComponent<ComponentType> }) {
  return (
    <Suspense fallback={null}>
      <Page />
    </Suspense>
  );
}
