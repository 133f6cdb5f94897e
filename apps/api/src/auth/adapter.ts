import type { Adapter, DatabaseSession, DatabaseUser } from 'lucia';
import { findSessionWithUser, Session, type Database } from '@gloaming/db';

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
    // every signed-in request comes here: one query for plain values, no entities to track
    const found = await findSessionWithUser(em, sessionId);
    if (!found) return [null, null];
    if (Date.now() - found.createdAt.getTime() >= this.absoluteMs) {
      await em.nativeDelete(Session, { id: found.sessionId });
      return [null, null];
    }
    const { user } = found;
    if (!user.active) return [null, null];
    return [
      { id: found.sessionId, userId: user.id, expiresAt: found.expiresAt, attributes: { organizationId: found.sessionOrganizationId } },
      {
        id: user.id,
        attributes: {
          email: user.email,
          name: user.name,
          role: user.role,
          organizationId: user.organizationId,
          organizationName: user.organizationName,
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
