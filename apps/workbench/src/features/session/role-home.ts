import type { Role } from '@gloaming/contracts';

/** Where each role lands after signing in. */
export const ROLE_HOME: Record<Role, string> = {
  owner: '/overview',
  estimator: '/quotes',
  installer: '/jobs',
};

/** Only same-app paths are followed after sign-in, never another origin. */
export function safeReturnPath(value: string | null): string | null {
  if (!value || !value.startsWith('/') || value.startsWith('//') || value.startsWith('/sign-in')) return null;
  return value;
}
