import { and, asc, desc, eq, isNull, or, sql, type SQL } from 'drizzle-orm';
import type { TokenKind } from '../../shared/api/accounts';
import type { UserSort } from '../../shared/api/user-admin';
import type { Role } from '../../shared/policy/policy';
import type { DbLike } from '../db/connection';
import type { AnySQLiteColumn } from 'drizzle-orm/sqlite-core';
import { prepared } from '../db/prepared';
import { accountTokens, users } from '../db/schema';
import { containsText } from '../db/text-match';

export type UserRow = typeof users.$inferSelect;

export function findUserByEmail(db: DbLike, email: string): UserRow | undefined {
  return db.select().from(users).where(eq(users.email, email.toLowerCase())).get();
}

export function findUserById(db: DbLike, id: number): UserRow | undefined {
  return prepared(db, 'user.byId', () =>
    db
      .select()
      .from(users)
      .where(eq(users.id, sql.placeholder('id')))
      .prepare(),
  ).get({ id });
}

export function listUsers(db: DbLike): UserRow[] {
  return db.select().from(users).orderBy(asc(users.id)).all();
}

export interface UserFilter {
  /** Part of the name or the e-mail address. */
  q?: string;
  role?: Role;
  sort: UserSort;
  order: 'asc' | 'desc';
  limit: number;
  offset: number;
}

const USER_ORDER: Record<UserSort, SQL | AnySQLiteColumn> = { name: sql`${users.name} COLLATE NOCASE`, email: users.email, role: users.role, created: users.createdAt };

function usersWhere(f: Pick<UserFilter, 'q' | 'role'>): SQL | undefined {
  const where: (SQL | undefined)[] = [];
  if (f.role) where.push(eq(users.role, f.role));
  if (f.q) where.push(or(containsText(users.name, f.q), containsText(users.email, f.q)));
  return where.length ? and(...where) : undefined;
}

/** One page of the users in the order asked for (equal values by id, in the same direction). */
export function pageUsers(db: DbLike, f: UserFilter): UserRow[] {
  const dir = f.order === 'asc' ? asc : desc;
  return db.select().from(users).where(usersWhere(f)).orderBy(dir(USER_ORDER[f.sort]), dir(users.id)).limit(f.limit).offset(f.offset).all();
}

export function countUsers(db: DbLike, f: Pick<UserFilter, 'q' | 'role'>): number {
  return (
    db
      .select({ n: sql<number>`count(*)` })
      .from(users)
      .where(usersWhere(f))
      .get()?.n ?? 0
  );
}

export function activeUsersWithRole(db: DbLike, roles: Role[]): UserRow[] {
  return listUsers(db).filter((u) => u.active && u.passwordHash && roles.includes(u.role));
}

export function insertUser(db: DbLike, u: { email: string; name: string; role: Role; passwordHash: string | null; active?: boolean }): UserRow {
  return db
    .insert(users)
    .values({ email: u.email.toLowerCase(), name: u.name, role: u.role, passwordHash: u.passwordHash, active: u.active ?? true, createdAt: Date.now() })
    .returning()
    .get();
}

export function updateUser(db: DbLike, id: number, patch: Partial<Pick<UserRow, 'name' | 'role' | 'active' | 'passwordHash'>>): UserRow | undefined {
  return db.update(users).set(patch).where(eq(users.id, id)).returning().get();
}

export function insertToken(db: DbLike, t: { kind: TokenKind; userId: number; tokenHash: string; expiresAt: number }): void {
  db.insert(accountTokens)
    .values({ ...t, createdAt: Date.now() })
    .run();
}

export function findUnusedToken(db: DbLike, tokenHash: string) {
  return db
    .select()
    .from(accountTokens)
    .where(and(eq(accountTokens.tokenHash, tokenHash), isNull(accountTokens.usedAt)))
    .get();
}

export function markTokenUsed(db: DbLike, id: number): void {
  db.update(accountTokens).set({ usedAt: Date.now() }).where(eq(accountTokens.id, id)).run();
}

/** Retires the unused tokens of a user (a newer link replaces older ones). */
export function retireTokens(db: DbLike, userId: number): void {
  db.update(accountTokens)
    .set({ usedAt: Date.now() })
    .where(and(eq(accountTokens.userId, userId), isNull(accountTokens.usedAt)))
    .run();
}
