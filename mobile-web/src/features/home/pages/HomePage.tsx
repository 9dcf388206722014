import { IonButton, IonButtons, IonContent, IonHeader, IonPage, IonTitle, IonToolbar } from '@ionic/react';
import { CautionNote } from '../../../components/CautionNote';
import { OnlineStatusBadge } from '../../../components/OnlineStatusBadge';
import './HomePage.css';

export function HomePage() {
  return (
    <IonPage>
      <IonHeader>
        <IonToolbar>
          <IonTitle>Plummet</IonTitle>
          <IonButtons slot="end" className="home-page__status">
            <OnlineStatusBadge />
          </IonButtons>
        </IonToolbar>
      </IonHeader>
      <IonContent className="ion-padding" data-testid="app-shell">
        <div className="home-page">
          <img className="home-page__mark" src="/icons/plummet.svg" alt="" width="96" height="96" />
          <h1 className="home-page__heading">What could fall, and how hard it would land</h1>
          <p className="home-page__lead">
            Plummet is the safety team&rsquo;s field tool for objects falling from scaffolds: walk the scaffold lift by
            lift, record each unsecured item with photos, get an estimate of its impact on the spot &mdash; with or
            without signal &mdash; and turn the walk into the signed inspection record and a fix list.
          </p>
          <CautionNote />
          <IonButton expand="block" routerLink="/sign-in" className="home-page__action">
            Sign in
          </IonButton>
        </div>
      </IonContent>
    </IonPage>
  );
}
