import { nextTask } from './next-task';

/**
 * The first string comparison by locale (localeCompare, as the home's site list is sorted) loads
 * the phone's collation data: 20 ms and more on a phone, inside whichever render sorts first.
 * Loaded here on its own, in a task of its own, before a screen that sorts draws.
 */
export async function loadCollation(): Promise<void> {
  'a'.localeCompare('b');
  await nextTask();
}
