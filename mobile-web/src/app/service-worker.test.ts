import type { RegisterSWOptions } from 'virtual:pwa-register';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';

const registerSW = vi.hoisted(() => vi.fn<(options: RegisterSWOptions) => (reloadPage?: boolean) => Promise<void>>());
vi.mock('virtual:pwa-register', () => ({ registerSW }));

/** A fresh copy of the module, as a newly opened page has. */
async function freshStore() {
  vi.resetModules();
  return import('./service-worker');
}

/** Lets the registration code load and every registration started so far run. */
async function settle(): Promise<void> {
  await vi.dynamicImportSettled();
  await new Promise((resolve) => setTimeout(resolve, 0));
}

/** What the page passed when it registered, once the registration code has loaded. */
async function registrationOptions(): Promise<RegisterSWOptions> {
  await settle();
  expect(registerSW).toHaveBeenCalledTimes(1);
  return registerSW.mock.calls[0]![0];
}

beforeEach(() => {
  registerSW.mockReset();
  registerSW.mockReturnValue(async () => undefined);
  vi.stubGlobal('navigator', { onLine: true });
});

afterEach(() => {
  vi.restoreAllMocks();
  vi.useRealTimers();
  vi.unstubAllGlobals();
});

describe('the service worker store', () => {
  it('does not register until something subscribes', async () => {
    const store = await freshStore();
    store.isNewVersionWaiting();
    store.isReadyOffline();
    await settle();
    expect(registerSW).not.toHaveBeenCalled();
  });

  it('registers once however many prompts subscribe, after the window has loaded', async () => {
    const store = await freshStore();
    // The home's prompt, then the full app's prompt and the second mount of development builds.
    const unsubscribeHome = store.subscribeToServiceWorker(() => undefined);
    unsubscribeHome();
    store.subscribeToServiceWorker(() => undefined);
    store.subscribeToServiceWorker(() => undefined);
    expect((await registrationOptions()).immediate).toBe(false);

    store.subscribeToServiceWorker(() => undefined);
    await settle();
    expect(registerSW).toHaveBeenCalledTimes(1);
  });

  it('tells every subscriber that a new version waits, and keeps it for a prompt that subscribes later', async () => {
    const store = await freshStore();
    const home = vi.fn();
    store.subscribeToServiceWorker(home);
    expect(store.isNewVersionWaiting()).toBe(false);

    (await registrationOptions()).onNeedRefresh!();

    expect(home).toHaveBeenCalledTimes(1);
    expect(store.isNewVersionWaiting()).toBe(true);
    expect(store.isReadyOffline()).toBe(false);
    const app = vi.fn();
    store.subscribeToServiceWorker(app);
    expect(store.isNewVersionWaiting()).toBe(true);

    store.dismissNewVersion();
    expect(store.isNewVersionWaiting()).toBe(false);
    expect(home).toHaveBeenCalledTimes(2);
    expect(app).toHaveBeenCalledTimes(1);
  });

  it('tells subscribers the app works offline, and forgets it when dismissed', async () => {
    const store = await freshStore();
    const listener = vi.fn();
    store.subscribeToServiceWorker(listener);

    (await registrationOptions()).onOfflineReady!();
    expect(store.isReadyOffline()).toBe(true);
    expect(store.isNewVersionWaiting()).toBe(false);
    store.dismissOfflineReady();
    expect(store.isReadyOffline()).toBe(false);
    expect(listener).toHaveBeenCalledTimes(2);
  });

  it('stops telling a subscriber that has left', async () => {
    const store = await freshStore();
    const listener = vi.fn();
    const unsubscribe = store.subscribeToServiceWorker(listener);
    unsubscribe();

    (await registrationOptions()).onNeedRefresh!();
    expect(listener).not.toHaveBeenCalled();
  });

  it('sets up one hourly update check, which asks only when online and not already installing', async () => {
    const store = await freshStore();
    store.subscribeToServiceWorker(() => undefined);
    store.subscribeToServiceWorker(() => undefined);
    await settle();
    vi.useFakeTimers();
    const setInterval = vi.spyOn(globalThis, 'setInterval');
    const registration = { installing: null as ServiceWorker | null, update: vi.fn(async () => undefined) };

    // Every registration started answers, as the browser would.
    for (const [options] of registerSW.mock.calls) options.onRegisteredSW!('/sw.js', registration as unknown as ServiceWorkerRegistration);

    expect(setInterval).toHaveBeenCalledTimes(1);
    vi.advanceTimersByTime(60 * 60 * 1000);
    expect(registration.update).toHaveBeenCalledTimes(1);

    vi.stubGlobal('navigator', { onLine: false });
    vi.advanceTimersByTime(60 * 60 * 1000);
    expect(registration.update).toHaveBeenCalledTimes(1);

    vi.stubGlobal('navigator', { onLine: true });
    registration.installing = {} as ServiceWorker;
    vi.advanceTimersByTime(60 * 60 * 1000);
    expect(registration.update).toHaveBeenCalledTimes(1);
  });

  it('sets up no update check when registration gave no registration', async () => {
    const setInterval = vi.spyOn(globalThis, 'setInterval');
    const store = await freshStore();
    store.subscribeToServiceWorker(() => undefined);

    (await registrationOptions()).onRegisteredSW!('/sw.js', undefined);
    expect(setInterval).not.toHaveBeenCalled();
  });

  it('logs a failed registration', async () => {
    const log = vi.spyOn(console, 'error').mockImplementation(() => undefined);
    const store = await freshStore();
    store.subscribeToServiceWorker(() => undefined);

    const failure = new Error('no worker for you');
    (await registrationOptions()).onRegisterError!(failure);
    expect(log).toHaveBeenCalledWith(expect.stringContaining('service worker registration failed'), failure);
  });

  it('logs a registration that could not start, and does not try again', async () => {
    const log = vi.spyOn(console, 'error').mockImplementation(() => undefined);
    const failure = new Error('registration code not reachable');
    registerSW.mockImplementation(() => {
      throw failure;
    });
    const store = await freshStore();
    store.subscribeToServiceWorker(() => undefined);
    await settle();
    store.subscribeToServiceWorker(() => undefined);
    await settle();

    expect(registerSW).toHaveBeenCalledTimes(1);
    expect(log).toHaveBeenCalledWith(expect.stringContaining('service worker registration failed'), failure);
  });
});

describe('reloading into the new version', () => {
  /** A page whose service worker container has `waiting` as its registration's waiting worker. */
  function stubPage(waiting: ServiceWorker | null) {
    const reload = vi.fn();
    const events = new EventTarget();
    const serviceWorker = {
      getRegistration: async () => ({ waiting }),
      addEventListener: events.addEventListener.bind(events),
    };
    vi.stubGlobal('navigator', { onLine: true, serviceWorker });
    vi.stubGlobal('window', { location: { reload } });
    return { reload, takeControl: () => events.dispatchEvent(new Event('controllerchange')) };
  }

  it('activates the waiting worker and reloads once it controls the page', async () => {
    const activate = vi.fn(async () => undefined);
    registerSW.mockReturnValue(activate);
    const page = stubPage({} as ServiceWorker);
    const store = await freshStore();
    store.subscribeToServiceWorker(() => undefined);

    await store.reloadIntoNewVersion();
    expect(activate).toHaveBeenCalledTimes(1);
    expect(page.reload).not.toHaveBeenCalled();
    page.takeControl();
    page.takeControl();
    expect(page.reload).toHaveBeenCalledTimes(1);
  });

  it('just reloads when no worker is waiting any more', async () => {
    const activate = vi.fn(async () => undefined);
    registerSW.mockReturnValue(activate);
    const page = stubPage(null);
    const store = await freshStore();
    store.subscribeToServiceWorker(() => undefined);

    await store.reloadIntoNewVersion();
    expect(activate).not.toHaveBeenCalled();
    expect(page.reload).toHaveBeenCalledTimes(1);
  });
});
