import type { EntityManager } from '@mikro-orm/core';
import { Seeder } from '@mikro-orm/seeder';
import { Organization, User } from '../entities';
import { hashPassword } from '../passwords';
import { DEMO_ACCOUNTS, DEMO_FIRM } from './demo-accounts';

/** The demo firm with one owner, two estimators and one installer. */
export class DemoSeeder extends Seeder {
  async run(em: EntityManager): Promise<void> {
    const firm = em.create(Organization, { ...DEMO_FIRM });
    const hashes = new Map<string, string>();
    for (const account of DEMO_ACCOUNTS) {
      const hash = hashes.get(account.password) ?? (await hashPassword(account.password));
      hashes.set(account.password, hash);
      em.create(User, {
        organization: firm,
        email: account.email,
        name: account.name,
        role: account.role,
        passwordHash: hash,
      });
    }
    await em.flush();
  }
}
