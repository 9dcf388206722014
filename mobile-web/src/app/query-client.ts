import { MutationCache, QueryClient } from '@tanstack/react-query';

declare module '@tanstack/react-query' {
  interface Register {
    mutationMeta: {
      /** Toast text on failure; false when the screen shows the error itself. */
      errorToast?: string | false;
    };
  }
}

export type ErrorNotifier = (message: string) => void;

let currentNotifier: ErrorNotifier = (message) => console.error(`[plummet] ${message}`);

/** The app shell installs the real toast here (src/app/MutationErrorToasts.tsx). */
export function setErrorNotifier(notifier: ErrorNotifier): () => void {
  const previous = currentNotifier;
  currentNotifier = notifier;
  return () => {
    currentNotifier = previous;
  };
}

function messageOf(error: unknown): string {
  return error instanceof Error && error.message ? error.message : 'Something went wrong.';
}

/**
 * Mutation errors are toasted once, here, rather than in every screen (TanStack Query's offline
 * example). A mutation with its own onError, or meta.errorToast === false, handles its error itself.
 */
export function createQueryClient(notify: ErrorNotifier = (message) => currentNotifier(message)): QueryClient {
  return new QueryClient({
    mutationCache: new MutationCache({
      onError: (error, _variables, _context, mutation) => {
        const toast = mutation.meta?.errorToast;
        if (toast === false || mutation.options.onError) return;
        notify(typeof toast === 'string' ? toast : messageOf(error));
      },
    }),
    defaultOptions: {
      queries: {
        // The UI reads Dexie first; server queries are for screens that are online-only.
        staleTime: 30_000,
        retry: 1,
        networkMode: 'offlineFirst',
      },
      mutations: { networkMode: 'offlineFirst' },
    },
  });
}

export const queryClient = createQueryClient();
