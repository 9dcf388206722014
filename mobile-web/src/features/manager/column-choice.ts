/** Which columns of the findings table a user shows, remembered per user in this browser. */
const key = (userId: string) => `plummet.findings-columns.${userId}`;

export function readColumnChoice(userId: string): Record<string, boolean> {
  try {
    const raw = localStorage.getItem(key(userId));
    const value: unknown = raw ? JSON.parse(raw) : {};
    if (typeof value !== 'object' || value === null) return {};
    return Object.fromEntries(Object.entries(value).filter(([, v]) => typeof v === 'boolean')) as Record<string, boolean>;
  } catch {
    return {};
  }
}

export function saveColumnChoice(userId: string, choice: Record<string, boolean>): void {
  try {
    localStorage.setItem(key(userId), JSON.stringify(choice));
  } catch {
    // Blocked storage: the choice holds for this visit only.
  }
}
