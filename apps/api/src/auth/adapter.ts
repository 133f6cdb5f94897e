import type { Adapter, DatabaseSession, DatabaseUser } from 'lucia';
import { Session, type Database } from '@gloaming/db';

/**
 * Lucia's storage interface over MikroORM. Each call uses its own fork of the entity
 * manager, so it never shares state with a request's unit of work.
 */
export class MikroOrmSessionAdapter implements Adapter {
  /** `absoluteMs`: a session older than this since sign-in is ended whatever its use. */
  constructor(
    private readonly orm: Database,
    private readonly absoluteMs: number,
  ) {}

  async getSessionAndUser(sessionId: string): Promise<[DatabaseSession | null, DatabaseUser | null]> {
    const em = this.orm.em.fork();
    const session = await em.findOne(Session, { id: sessionId }, { populate: ['user', 'user.organization'] });
    if (!session) return [null, null];
    if (Date.now() - session.createdAt.getTime() >= this.absoluteMs) {
      await em.nativeDelete(Session, { id: session.id });
      return [null, null];
    }
    const user = session.user;
    if (!user.active) return [null, null];
    return [
      { id: session.id, userId: user.id, expiresAt: session.expiresAt, attributes: { organizationId: session.organization.id } },
      {
        id: user.id,
        attributes: {
          email: user.email,
          name: user.name,
          role: user.role,
          organizationId: user.organization.id,
          organizationName: user.organization.name,
        },
      },
    ];
  }

  async getUserSessions(userId: string): Promise<DatabaseSession[]> {
    const em = this.orm.em.fork();
    const sessions = await em.find(Session, { user: userId });
    return sessions.map((s) => ({
      id: s.id,
      userId,
      expiresAt: s.expiresAt,
      attributes: { organizationId: s.organization.id },
    }));
  }

  async setSession(session: DatabaseSession): Promise<void> {
    const em = this.orm.em.fork();
    em.create(Session, {
      id: session.id,
      user: session.userId,
      organization: session.attributes.organizationId,
      expiresAt: session.expiresAt,
    });
    await em.flush();
  }

  async updateSessionExpiration(sessionId: string, expiresAt: Date): Promise<void> {
    await this.orm.em.fork().nativeUpdate(Session, { id: sessionId }, { expiresAt });
  }

  async deleteSession(sessionId: string): Promise<void> {
    await this.orm.em.fork().nativeDelete(Session, { id: sessionId });
  }

  async deleteUserSessions(userId: string): Promise<void> {
    await this.orm.em.fork().nativeDelete(Session, { user: userId });
  }

  async deleteExpiredSessions(): Promise<void> {
    await this.orm.em.fork().nativeDelete(Session, { expiresAt: { $lte: new Date() } });
  }
}
