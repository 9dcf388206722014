import { IonApp, IonRouterOutlet } from '@ionic/react';
import { IonReactRouter } from '@ionic/react-router';
import { QueryClientProvider } from '@tanstack/react-query';
import { Navigate, Route, Routes } from 'react-router-dom';
import { SignInPage } from '../features/auth/pages/SignInPage';
import { HomePage } from '../features/home/pages/HomePage';
import { MutationErrorToasts } from './MutationErrorToasts';
import { queryClient } from './query-client';
import { ReloadPrompt } from './ReloadPrompt';

export function App() {
  return (
    <QueryClientProvider client={queryClient}>
      <IonApp>
        <IonReactRouter>
          <IonRouterOutlet>
            <Routes>
              <Route path="/" element={<HomePage />} />
              <Route path="/sign-in" element={<SignInPage />} />
              <Route path="*" element={<Navigate to="/" replace />} />
            </Routes>
          </IonRouterOutlet>
        </IonReactRouter>
        <MutationErrorToasts />
        <ReloadPrompt />
      </IonApp>
    </QueryClientProvider>
  );
}
