import type { Role } from '@plummet/shared';

/**
 * Where each role starts after sign-in and on '/': inspectors on their sites and walks, foremen on
 * their fix list, managers and admins on the overview. Every other screen their role allows stays
 * reachable from there.
 */
export function homePathFor(role: Role): string {
  switch (role) {
    case 'inspector':
      return '/';
    case 'foreman':
      return '/fix-list';
    case 'manager':
    case 'admin':
      return '/overview';
  }
}
