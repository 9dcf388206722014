/** Roles a user can hold in an organisation. */
export const ROLE_VALUES = ['inspector', 'foreman', 'manager', 'admin'] as const;
export type Role = (typeof ROLE_VALUES)[number];
