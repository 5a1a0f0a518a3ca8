import type { Role } from '@shared/api/roles';

/** One area of the app as the navigation shows it. */
export interface Area {
  path: string;
  label: string;
  icon: string;
  roles: readonly Role[];
  testId: string;
}

/** The areas in navigation order; the first one a person may use is their home. */
export const AREAS: readonly Area[] = [
  { path: 'archive', label: 'Archive', icon: 'inventory_2', roles: ['archivist'], testId: 'nav-archive' },
  { path: 'desk', label: 'Desk', icon: 'edit_note', roles: ['volunteer'], testId: 'nav-desk' },
  { path: 'lessons', label: 'Lessons', icon: 'school', roles: ['teacher'], testId: 'nav-lessons' },
  { path: 'series', label: 'Series', icon: 'show_chart', roles: ['climatologist', 'teacher'], testId: 'nav-series' },
  { path: 'people', label: 'People', icon: 'group', roles: ['admin'], testId: 'nav-people' },
];

/** Roles allowed at the Bench (not in the navigation: it is opened from the Desk). */
export const BENCH_ROLES: readonly Role[] = ['volunteer'];

export function rolesFor(path: string): readonly Role[] {
  const area = AREAS.find((a) => a.path === path);
  if (!area) throw new Error(`no area ${path}`);
  return area.roles;
}

/** Areas open to someone holding any of the given roles. */
export function areasFor(roles: readonly Role[]): Area[] {
  return AREAS.filter((area) => area.roles.some((role) => roles.includes(role)));
}
