import { IonApp, IonRouterOutlet } from '@ionic/react';
import { IonReactRouter } from '@ionic/react-router';
import { QueryClientProvider } from '@tanstack/react-query';
import { Suspense } from 'react';
import { Navigate, Route, Routes } from 'react-router-dom';
import {
  AcceptInvitePage,
  CalculatorPage,
  CatalogueSetupPage,
  OrganisationSettingsPage,
  PeoplePage,
  ScaffoldFormPage,
  SiteFormPage,
  SitesSetupPage,
  FindingEditorPage,
  FindingListPage,
  FixListPage,
  FixPage,
  FindingsTablePage,
  FailedMailPage,
  ManagerFindingPage,
  OverviewPage,
  ReportsPage,
  TrendsPage,
  HomePage,
  InspectionFinishPage,
  InspectionPage,
  Lazy,
  ScaffoldPage,
  SettingsPage,
  ShiftPage,
  SyncRunner,
  SignInPage,
  SitePage,
  SyncStatusPage,
  ToVerifyPage,
} from './lazy-pages';
import { useAfterFirstScreen } from './after-first-screen';
import { MutationErrorToasts } from './MutationErrorToasts';
import { queryClient } from './query-client';
import { ReloadPrompt } from './ReloadPrompt';

export function App() {
  // The sync engine (and its code) waits until the first screen is up and the phone is idle.
  const syncAllowed = useAfterFirstScreen();
  return (
    <QueryClientProvider client={queryClient}>
      <IonApp>
        <IonReactRouter>
          <IonRouterOutlet>
            <Routes>
              <Route path="/" element={<Lazy page={HomePage} />} />
              <Route path="/sign-in" element={<Lazy page={SignInPage} />} />
              <Route path="/accept-invite" element={<Lazy page={AcceptInvitePage} />} />
              <Route path="/sites/:siteId" element={<Lazy page={SitePage} />} />
              <Route path="/sites/:siteId/findings" element={<Lazy page={FindingListPage} />} />
              <Route path="/scaffolds/:scaffoldId" element={<Lazy page={ScaffoldPage} />} />
              <Route path="/inspections/:inspectionId" element={<Lazy page={InspectionPage} />} />
              <Route path="/inspections/:inspectionId/finish" element={<Lazy page={InspectionFinishPage} />} />
              <Route path="/inspections/:inspectionId/findings/new" element={<Lazy page={FindingEditorPage} />} />
              <Route path="/findings/:findingId" element={<Lazy page={FindingEditorPage} />} />
              <Route path="/overview" element={<Lazy page={OverviewPage} />} />
              <Route path="/findings" element={<Lazy page={FindingsTablePage} />} />
              <Route path="/review/:findingId" element={<Lazy page={ManagerFindingPage} />} />
              <Route path="/trends" element={<Lazy page={TrendsPage} />} />
              <Route path="/reports" element={<Lazy page={ReportsPage} />} />
              <Route path="/mail/failed" element={<Lazy page={FailedMailPage} />} />
              <Route path="/calculator" element={<Lazy page={CalculatorPage} />} />
              <Route path="/settings" element={<Lazy page={SettingsPage} />} />
              <Route path="/sync" element={<Lazy page={SyncStatusPage} />} />
              <Route path="/fix-list" element={<Lazy page={FixListPage} />} />
              <Route path="/fix-list/:findingId" element={<Lazy page={FixPage} />} />
              <Route path="/shift" element={<Lazy page={ShiftPage} />} />
              <Route path="/to-verify" element={<Lazy page={ToVerifyPage} />} />
              <Route path="/setup/sites" element={<Lazy page={SitesSetupPage} />} />
              <Route path="/setup/sites/new" element={<Lazy page={SiteFormPage} />} />
              <Route path="/setup/sites/:siteId" element={<Lazy page={SiteFormPage} />} />
              <Route path="/setup/sites/:siteId/scaffolds/new" element={<Lazy page={ScaffoldFormPage} />} />
              <Route path="/setup/scaffolds/:scaffoldId" element={<Lazy page={ScaffoldFormPage} />} />
              <Route path="/setup/people" element={<Lazy page={PeoplePage} />} />
              <Route path="/setup/organisation" element={<Lazy page={OrganisationSettingsPage} />} />
              <Route path="/setup/catalogue" element={<Lazy page={CatalogueSetupPage} />} />
              <Route path="*" element={<Navigate to="/" replace />} />
            </Routes>
          </IonRouterOutlet>
        </IonReactRouter>
        {syncAllowed && (
          <Suspense fallback={null}>
            <SyncRunner />
          </Suspense>
        )}
        <MutationErrorToasts />
        <ReloadPrompt />
      </IonApp>
    </QueryClientProvider>
  );
}
