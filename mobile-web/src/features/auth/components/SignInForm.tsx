import { useEffect, useState, type FormEvent } from 'react';
import type { StoredSession } from '../session';
import './SignInForm.css';

interface SignInFormProps {
  /** Offered in the email field (signing in again after the session ran out: the same account). */
  initialEmail?: string;
  onSignedIn: (session: StoredSession) => void;
}

/**
 * The sign-in form in plain React with the app's look (outlined fields, a solid block button):
 * it is the first screen of a first visit, which must show before Ionic has even been loaded.
 */
export function SignInForm({ initialEmail, onSignedIn }: SignInFormProps) {
  const [email, setEmail] = useState('');
  const [password, setPassword] = useState('');
  const [error, setError] = useState<string | null>(null);
  const [pending, setPending] = useState(false);

  // Signing in again after the session ran out: the same account, so the phone's records carry on.
  useEffect(() => {
    if (initialEmail) setEmail((typed) => typed || initialEmail);
  }, [initialEmail]);

  async function submit(event: FormEvent) {
    event.preventDefault();
    if (!email.trim() || !password) {
      setError('Enter your email and password.');
      return;
    }
    setError(null);
    setPending(true);
    // The local database and the session's schema load only now, not with the form.
    const { signInAndKeep, describeSignInError } = await import('../sign-in');
    try {
      const session = await signInAndKeep({ email: email.trim(), password });
      onSignedIn(session);
    } catch (failure) {
      setError(describeSignInError(failure));
    } finally {
      setPending(false);
    }
  }

  return (
    <form className="sign-in" onSubmit={(event) => void submit(event)} noValidate>
      <p className="sign-in__intro">Sign in once with a connection; Plummet then keeps working offline.</p>
      <label className="outlined-field" data-testid="sign-in-email">
        <span className="outlined-field__label">Email</span>
        <input
          className="outlined-field__input"
          type="email"
          name="email"
          autoComplete="username"
          inputMode="email"
          value={email}
          onChange={(event) => setEmail(event.target.value)}
        />
      </label>
      <label className="outlined-field" data-testid="sign-in-password">
        <span className="outlined-field__label">Password</span>
        <input
          className="outlined-field__input"
          type="password"
          name="password"
          autoComplete="current-password"
          value={password}
          onChange={(event) => setPassword(event.target.value)}
        />
      </label>
      {error && (
        <p role="alert" className="sign-in__error" data-testid="sign-in-error">
          {error}
        </p>
      )}
      <button type="submit" className="sign-in__submit" disabled={pending} data-testid="sign-in-submit">
        {pending ? 'Signing in…' : 'Sign in'}
      </button>
    </form>
  );
}
