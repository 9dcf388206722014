import { nextTask } from '../lib/next-task';

/*
 * Building zod and the shared schemas is the longest piece of work of a start (a hundred
 * milliseconds and more on a phone), and a module runs in one task with everything it imports
 * that has not run yet. Imported a group at a time, each group in a task of its own, the same
 * work leaves the phone free to paint and answer a tap in between. A step already built costs
 * nothing, so screens that need the schemas later find them ready.
 */
const STEPS = {
  common: () => import('./schema-steps/schemas-common'),
  sites: () => import('./schema-steps/schemas-sites'),
  scaffolds: () => import('./schema-steps/schemas-scaffolds'),
  inspections: () => import('./schema-steps/schemas-inspections'),
  register: () => import('./schema-steps/schemas-register'),
  findings: () => import('./schema-steps/schemas-findings'),
  catalogue: () => import('./schema-steps/schemas-catalogue'),
  users: () => import('./schema-steps/schemas-users'),
  settings: () => import('./schema-steps/schemas-settings'),
  sync: () => import('./schema-steps/schemas-sync'),
} satisfies Record<string, () => Promise<unknown>>;

type Step = keyof typeof STEPS;

/** What the signed-in home checks the server's answers with: the sites and the due list. */
export const HOME_SCHEMAS: readonly Step[] = ['common', 'sites', 'scaffolds', 'inspections', 'register'];

/** What the sync engine checks: every record it pulls, the foremen and the organisation's settings. */
export const SYNC_SCHEMAS: readonly Step[] = [...HOME_SCHEMAS, 'findings', 'catalogue', 'users', 'settings', 'sync'];

const built = new Set<Step>();

/**
 * Builds the schemas of `steps`, one step per task, before code that imports them loads. A step
 * that fails to load is left to that code's own import, which reports it.
 */
export async function buildSchemasInSteps(steps: readonly Step[]): Promise<void> {
  for (const step of steps) {
    if (built.has(step)) continue;
    try {
      await STEPS[step]();
      built.add(step);
    } catch {
      return;
    }
    await nextTask();
  }
}
