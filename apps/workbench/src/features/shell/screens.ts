import type { Role } from '@gloaming/contracts';

/** The screens that exist inside the shell and who may open them; navigation is built from this. */
export const SCREENS = [
  { path: '/overview', label: 'Overview', roles: ['owner'] },
  { path: '/figures', label: 'Figures', roles: ['owner'] },
  { path: '/activity', label: 'Activity', roles: ['owner'] },
  { path: '/quotes', label: 'Quotes', roles: ['owner', 'estimator'] },
  { path: '/customers', label: 'Customers', roles: ['owner', 'estimator'] },
  { path: '/catalogue', label: 'Catalogue', roles: ['owner', 'estimator'] },
  { path: '/jobs', label: 'Jobs', roles: ['owner', 'estimator', 'installer'] },
  { path: '/settings', label: 'Settings', roles: ['owner'] },
] as const satisfies ReadonlyArray<{ path: string; label: string; roles: ReadonlyArray<Role> }>;

export type ScreenPath = (typeof SCREENS)[number]['path'];

export function screensFor(role: Role) {
  return SCREENS.filter((screen) => (screen.roles as ReadonlyArray<Role>).includes(role));
}

export function rolesFor(path: ScreenPath): ReadonlyArray<Role> {
  return SCREENS.find((screen) => screen.path === path)?.roles ?? [];
}
