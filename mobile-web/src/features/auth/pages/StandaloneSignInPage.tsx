import { useEffect, useState } from 'react';
import type { StoredSession } from '../session';
import { SignInForm } from '../components/SignInForm';
import { readStoredEmail } from '../stored-email';
import './StandaloneSignInPage.css';

interface StandaloneSignInPageProps {
  onBack: () => void;
  onSignedIn: (session: StoredSession) => void;
}

/**
 * /sign-in opened straight from the address bar: the same screen as the in-app sign-in
 * (pages/SignInPage.tsx), with a toolbar drawn like Ionic's, before Ionic is loaded.
 */
export function StandaloneSignInPage({ onBack, onSignedIn }: StandaloneSignInPageProps) {
  const [storedEmail, setStoredEmail] = useState<string>();
  useEffect(() => {
    void readStoredEmail().then(setStoredEmail);
  }, []);

  return (
    <div className="standalone-page">
      <header className="standalone-page__bar">
        <button type="button" className="standalone-page__back" aria-label="Back" onClick={onBack}>
          <svg viewBox="0 0 512 512" width="24" height="24" aria-hidden="true">
            <path d="M244 400 100 256l144-144M120 256h292" fill="none" stroke="currentColor" strokeLinecap="square" strokeMiterlimit="10" strokeWidth="48" />
          </svg>
        </button>
        <h1 className="standalone-page__title">Sign in</h1>
      </header>
      <main className="standalone-page__content">
        <SignInForm initialEmail={storedEmail} onSignedIn={onSignedIn} />
      </main>
    </div>
  );
}
