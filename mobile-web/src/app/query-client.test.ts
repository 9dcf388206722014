import { MutationObserver } from '@tanstack/react-query';
import { describe, expect, it, vi } from 'vitest';
import { createQueryClient } from './query-client';

async function runFailingMutation(
  notify: (message: string) => void,
  options: { meta?: { errorToast?: string | false }; onError?: () => void } = {},
): Promise<void> {
  const client = createQueryClient(notify);
  const observer = new MutationObserver(client, {
    mutationFn: async () => {
      throw new Error('The server refused the change.');
    },
    retry: false,
    ...options,
  });
  await observer.mutate().catch(() => undefined);
}

describe('createQueryClient', () => {
  it('shows one error toast with the error message when a mutation fails', async () => {
    const notify = vi.fn();
    await runFailingMutation(notify);
    expect(notify).toHaveBeenCalledTimes(1);
    expect(notify).toHaveBeenCalledWith('The server refused the change.');
  });

  it('uses the toast text a mutation gives in its meta', async () => {
    const notify = vi.fn();
    await runFailingMutation(notify, { meta: { errorToast: 'Could not save the finding.' } });
    expect(notify).toHaveBeenCalledWith('Could not save the finding.');
  });

  it('stays quiet when the screen handles the error itself', async () => {
    const notify = vi.fn();
    await runFailingMutation(notify, { meta: { errorToast: false } });
    await runFailingMutation(notify, { onError: () => undefined });
    expect(notify).not.toHaveBeenCalled();
  });
});
