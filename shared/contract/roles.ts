// Workspace roles from lowest to highest; each role may do what the ones below it may.
export const ROLES = ['viewer', 'reviewer', 'editor', 'owner'] as const;
export type Role = (typeof ROLES)[number];

export const isRole = (value: unknown): value is Role =>
  typeof value === 'string' && (ROLES as readonly string[]).includes(value);

export const roleAtLeast = (role: Role, minimum: Role): boolean => ROLES.indexOf(role) >= ROLES.indexOf(minimum);
