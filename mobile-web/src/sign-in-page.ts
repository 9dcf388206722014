/*
 * The script of sign-in.html, the page a first visit to /sign-in gets. The form is already on the
 * screen (drawn in the HTML, styles inlined at build time); this makes it work without React or
 * Ionic: it offers the email kept on the phone, signs in with the app's own attemptSignIn, and
 * then starts the full app in the same page (loaded only then, precached by the service worker).
 */

import './lib/zod-setup';

/* Open Sans, bundled (no CDN): latin subset, the three weights the theme uses, woff2 only. */
import '@fontsource/open-sans/latin-400.css';
import '@fontsource/open-sans/latin-600.css';
import '@fontsource/open-sans/latin-700.css';

import './theme/variables.css';
import './theme/first-paint.css';
import './theme/standalone-page.css';
import './features/auth/components/SignInForm.css';

import { homePathFor } from './app/role-home';
import { attemptSignIn } from './features/auth/attempt-sign-in';
import { readStoredEmail } from './features/auth/stored-email';

/** Leaves the sign-in page for the full app at `path` (same page, no reload). */
async function openApp(path: string, how: 'push' | 'replace'): Promise<void> {
  if (how === 'push') window.history.pushState(null, '', path);
  else window.history.replaceState(null, '', path);
  const { startApp } = await import('./app/start-app');
  startApp();
}

function showError(form: HTMLFormElement, submit: HTMLButtonElement, message: string | null): void {
  let alert = form.querySelector<HTMLParagraphElement>('[data-testid="sign-in-error"]');
  if (message === null) {
    alert?.remove();
    return;
  }
  if (!alert) {
    alert = document.createElement('p');
    alert.setAttribute('role', 'alert');
    alert.className = 'sign-in__error';
    alert.dataset.testid = 'sign-in-error';
    form.insertBefore(alert, submit);
  }
  alert.textContent = message;
}

function enhance(): void {
  const form = document.querySelector<HTMLFormElement>('form.sign-in');
  const submit = form?.querySelector<HTMLButtonElement>('button[type="submit"]');
  const email = form?.elements.namedItem('email');
  const password = form?.elements.namedItem('password');
  if (!form || !submit || !(email instanceof HTMLInputElement) || !(password instanceof HTMLInputElement)) return;

  document.querySelector('[data-action="back"]')?.addEventListener('click', () => void openApp('/', 'push'));

  form.addEventListener('submit', (event) => {
    event.preventDefault();
    if (submit.disabled) return;
    showError(form, submit, null);
    submit.disabled = true;
    submit.textContent = 'Signing in…';
    void attemptSignIn(email.value, password.value).then((outcome) => {
      submit.disabled = false;
      submit.textContent = 'Sign in';
      if ('session' in outcome) void openApp(homePathFor(outcome.session.user.role), 'replace');
      else showError(form, submit, outcome.error);
    });
  });
  submit.disabled = false;

  // Signing in again after the session ran out: the same account, so the phone's records carry on.
  void readStoredEmail().then((stored) => {
    if (stored && !email.value) email.value = stored;
  });
}

enhance();
