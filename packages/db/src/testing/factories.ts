import type { EntityManager } from '@mikro-orm/core';
import { Organization, User, type Role } from '../entities';
import { hashPassword } from '../passwords';

/**
 * Test factories: a firm with one user of each role, all sharing one password. Tests use
 * these rather than the demo seeder so each test owns its data.
 */
export const FACTORY_PASSWORD = 'factory-password-1';

let counter = 0;
let cachedHash: Promise<string> | undefined;

export interface FirmFixture {
  firm: Organization;
  users: Record<Role, User>;
  password: string;
}

export async function createFirm(em: EntityManager, name?: string): Promise<FirmFixture> {
  counter++;
  const tag = `${Date.now().toString(36)}-${counter}`;
  cachedHash ??= hashPassword(FACTORY_PASSWORD);
  const passwordHash = await cachedHash;
  const firm = em.create(Organization, { name: name ?? `Test Firm ${tag}` });
  const make = (role: Role): User =>
    em.create(User, {
      organization: firm,
      email: `${role}-${tag}@firm.test`,
      name: `${role[0]!.toUpperCase()}${role.slice(1)} ${tag}`,
      role,
      passwordHash,
    });
  const users = { owner: make('owner'), estimator: make('estimator'), installer: make('installer') };
  await em.flush();
  return { firm, users, password: FACTORY_PASSWORD };
}
