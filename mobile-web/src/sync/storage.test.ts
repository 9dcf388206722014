import { describe, expect, it } from 'vitest';
import { describeStorage, formatBytes, requestPersistentStorage } from './storage';

function fakeStorage(answers: { persisted: boolean; persist: boolean; usage?: number; quota?: number }) {
  let asked = 0;
  return {
    asked: () => asked,
    storage: {
      persisted: async () => answers.persisted,
      persist: async () => {
        asked++;
        return answers.persist;
      },
      estimate: async () => ({ usage: answers.usage, quota: answers.quota }),
    },
  };
}

describe('the offline storage', () => {
  it('asks for persistent storage and reports what the browser granted and how much is used', async () => {
    const fake = fakeStorage({ persisted: false, persist: true, usage: 1_250_000, quota: 2_000_000_000 });
    const report = await requestPersistentStorage(fake.storage);
    expect(report).toEqual({ usedBytes: 1_250_000, quotaBytes: 2_000_000_000, persistence: 'granted' });
    expect(fake.asked()).toBe(1);
    expect(describeStorage(report)).toEqual({
      used: 'Plummet uses 1.3 MB on this phone (2.0 GB available to it).',
      persistence: 'The browser agreed to keep this data until you sign out or clear it.',
    });
  });

  it('does not ask again once granted, and says plainly when the browser only tries its best', async () => {
    const granted = fakeStorage({ persisted: true, persist: false });
    expect((await requestPersistentStorage(granted.storage)).persistence).toBe('granted');
    expect(granted.asked()).toBe(0);

    const refused = await requestPersistentStorage(fakeStorage({ persisted: false, persist: false, usage: 500 }).storage);
    expect(refused.persistence).toBe('best-effort');
    expect(describeStorage(refused).persistence).toMatch(/may clear it/);
    expect(describeStorage(await requestPersistentStorage(undefined)).used).toMatch(/does not say/);
  });

  it('formats sizes the way phones show them', () => {
    expect(formatBytes(512)).toBe('512 bytes');
    expect(formatBytes(840_000)).toBe('840 kB');
    expect(formatBytes(12_400_000)).toBe('12 MB');
  });
});
