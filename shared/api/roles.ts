/** The five roles of Isallo; a person may hold several. */
export const ROLES = ['admin', 'archivist', 'volunteer', 'climatologist', 'teacher'] as const;
export type Role = (typeof ROLES)[number];

export function isRole(value: unknown): value is Role {
  return typeof value === 'string' && (ROLES as readonly string[]).includes(value);
}
