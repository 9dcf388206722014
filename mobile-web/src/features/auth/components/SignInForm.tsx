import { useEffect, useState, type FormEvent } from 'react';
import { attemptSignIn } from '../attempt-sign-in';
import type { StoredSession } from '../session';
import './SignInForm.css';

interface SignInFormProps {
  /** Offered in the email field (signing in again after the session ran out: the same account). */
  initialEmail?: string;
  onSignedIn: (session: StoredSession) => void;
}

/**
 * The sign-in form in plain React with the app's look (outlined fields, a solid block button).
 * sign-in.html draws the same form as plain HTML for a first visit to /sign-in (same classes,
 * same styles, same attemptSignIn), so keep the two alike.
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
    setError(null);
    setPending(true);
    const outcome = await attemptSignIn(email, password);
    setPending(false);
    if ('session' in outcome) onSignedIn(outcome.session);
    else setError(outcome.error);
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
