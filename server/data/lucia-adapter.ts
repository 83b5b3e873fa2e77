/** lucia 3 Adapter over TypeORM: sessions live in the `sessions` table, users in `users`. */
import type { Adapter, DatabaseSession, DatabaseUser } from "lucia";
import { LessThanOrEqual, type DataSource } from "typeorm";
import { Session } from "./entities/session";
import { User } from "./entities/user";

/** Implements lucia's Adapter with plain repository calls. User attributes are left empty: the
 * HTTP layer loads the membership (team and role) itself on every request. */
export class TypeormLuciaAdapter implements Adapter {
  constructor(private readonly dataSource: DataSource) {}

  private get sessions() {
    return this.dataSource.getRepository(Session);
  }

  async getSessionAndUser(
    sessionId: string,
  ): Promise<[session: DatabaseSession | null, user: DatabaseUser | null]> {
    const session = await this.sessions.findOneBy({ id: sessionId });
    if (!session) return [null, null];
    const user = await this.dataSource.getRepository(User).findOneBy({ id: session.userId });
    if (!user) return [null, null];
    return [toDatabaseSession(session), { id: user.id, attributes: {} }];
  }

  async getUserSessions(userId: string): Promise<DatabaseSession[]> {
    const rows = await this.sessions.findBy({ userId });
    return rows.map(toDatabaseSession);
  }

  async setSession(session: DatabaseSession): Promise<void> {
    await this.sessions.insert({
      id: session.id,
      userId: session.userId,
      expiresAt: session.expiresAt,
    });
  }

  async updateSessionExpiration(sessionId: string, expiresAt: Date): Promise<void> {
    await this.sessions.update({ id: sessionId }, { expiresAt });
  }

  async deleteSession(sessionId: string): Promise<void> {
    await this.sessions.delete({ id: sessionId });
  }

  async deleteUserSessions(userId: string): Promise<void> {
    await this.sessions.delete({ userId });
  }

  async deleteExpiredSessions(): Promise<void> {
    await this.sessions.delete({ expiresAt: LessThanOrEqual(new Date()) });
  }
}

function toDatabaseSession(row: Session): DatabaseSession {
  return { id: row.id, userId: row.userId, expiresAt: row.expiresAt, attributes: {} };
}
