/**
 * Whether the phone can reach the Plummet server. navigator.onLine only says a network is
 * attached (a site hoarding's Wi-Fi with no uplink counts as online), so every API answer or
 * network failure also reports here, and a light probe runs at start and when the browser
 * says the network came back.
 */

type Listener = () => void;

const listeners = new Set<Listener>();
/** undefined until a request has answered or failed since the network last came back. */
let serverReachable: boolean | undefined;

/** A gateway answering 502/504 means the Plummet server behind it could not be reached. */
export function isGatewayFailure(status: number): boolean {
  return status === 502 || status === 504;
}

export function reportServerReachable(reachable: boolean): void {
  if (serverReachable === reachable) return;
  serverReachable = reachable;
  listeners.forEach((listener) => listener());
}

export function isOnline(): boolean {
  const networkAttached = typeof navigator === 'undefined' || navigator.onLine;
  return networkAttached && serverReachable !== false;
}

/** Asks the server's health route; any answer but a gateway failure means reachable. */
export async function probeServer(fetchImpl: typeof fetch = fetch): Promise<void> {
  try {
    const response = await fetchImpl('/api/health', { cache: 'no-store', headers: { Accept: 'application/json' } });
    reportServerReachable(!isGatewayFailure(response.status));
  } catch {
    reportServerReachable(false);
  }
}

function onNetworkChange(): void {
  serverReachable = undefined;
  listeners.forEach((listener) => listener());
  if (navigator.onLine) void probeServer();
}

export function subscribeToConnectivity(listener: Listener): () => void {
  if (listeners.size === 0) {
    window.addEventListener('online', onNetworkChange);
    window.addEventListener('offline', onNetworkChange);
    void probeServer();
  }
  listeners.add(listener);
  return () => {
    listeners.delete(listener);
    if (listeners.size === 0) {
      window.removeEventListener('online', onNetworkChange);
      window.removeEventListener('offline', onNetworkChange);
    }
  };
}
