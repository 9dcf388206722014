import { useMutation } from '@tanstack/react-query';
import { signIn, type SignInCredentials } from './auth.api';

/** Sign-in shows its errors in the form, so it opts out of the shared error toast. */
export function useSignInMutation() {
  return useMutation({
    mutationFn: (credentials: SignInCredentials) => signIn(credentials),
    meta: { errorToast: false },
  });
}
