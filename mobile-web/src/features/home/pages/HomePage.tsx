import { IonPage } from '@ionic/react';
import { HomeScreen } from '../components/HomeScreen';

/** The home inside the full app (its router's stack of pages); components/HomeScreen.tsx draws it. */
export function HomePage() {
  return (
    <IonPage>
      <HomeScreen />
    </IonPage>
  );
}
