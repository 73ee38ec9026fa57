import { sql } from 'drizzle-orm';
import { index, integer, sqliteTable, text, uniqueIndex, type AnySQLiteColumn } from 'drizzle-orm/sqlite-core';

/** All times are milliseconds since the epoch (UTC). */
const now = sql`(CAST(unixepoch('subsec') * 1000 AS INTEGER))`;

export const users = sqliteTable('users', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  email: text('email').notNull().unique(),
  name: text('name').notNull(),
  role: text('role', { enum: ['admin', 'metrologist', 'reviewer', 'auditor', 'trainee'] }).notNull(),
  /** `scrypt$N$r$p$salt$hash`; null until an invited user sets a password. */
  passwordHash: text('password_hash'),
  active: integer('active', { mode: 'boolean' }).notNull().default(true),
  createdAt: integer('created_at').notNull().default(now),
});

/** express-session records. */
export const httpSessions = sqliteTable(
  'http_sessions',
  {
    sid: text('sid').primaryKey(),
    data: text('data').notNull(),
    expiresAt: integer('expires_at').notNull(),
  },
  (t) => [index('http_sessions_expires_idx').on(t.expiresAt)],
);

/** Key-value settings the server keeps for itself (e.g. the generated session secret). */
export const appSettings = sqliteTable('app_settings', {
  key: text('key').primaryKey(),
  value: text('value').notNull(),
});

export const budgets = sqliteTable(
  'budgets',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    title: text('title').notNull(),
    ownerId: integer('owner_id')
      .notNull()
      .references(() => users.id),
    status: text('status', { enum: ['draft', 'in_review', 'approved'] })
      .notNull()
      .default('draft'),
    /** Set when a reviewer sent the budget back; cleared when it is submitted again. */
    returned: integer('returned', { mode: 'boolean' }).notNull().default(false),
    isTemplate: integer('is_template', { mode: 'boolean' }).notNull().default(false),
    currentVersion: integer('current_version').notNull(),
    /** The most recent approved version, kept when later drafts are saved. */
    approvedVersion: integer('approved_version'),
    sourceBudgetId: integer('source_budget_id'),
    sourceVersion: integer('source_version'),
    createdAt: integer('created_at').notNull().default(now),
    updatedAt: integer('updated_at').notNull().default(now),
  },
  (t) => [index('budgets_owner_idx').on(t.ownerId), index('budgets_status_idx').on(t.status)],
);

export const budgetVersions = sqliteTable(
  'budget_versions',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    budgetId: integer('budget_id')
      .notNull()
      .references(() => budgets.id),
    number: integer('number').notNull(),
    authorId: integer('author_id')
      .notNull()
      .references(() => users.id),
    createdAt: integer('created_at').notNull().default(now),
    note: text('note').notNull().default(''),
    /** The full budget file (JSON text). */
    document: text('document').notNull(),
    /** The computed result (JSON text); a version never exists without it. */
    result: text('result').notNull(),
    seed: text('seed').notNull(),
    engineVersion: text('engine_version').notNull(),
    /** SHA-256 (hex) of the canonical JSON of the document. */
    documentSha256: text('document_sha256').notNull(),
    approvedBy: integer('approved_by').references(() => users.id),
    approvedAt: integer('approved_at'),
  },
  (t) => [uniqueIndex('budget_versions_budget_number_uq').on(t.budgetId, t.number)],
);

export const comments = sqliteTable(
  'comments',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    budgetId: integer('budget_id')
      .notNull()
      .references(() => budgets.id),
    versionNumber: integer('version_number').notNull(),
    /** Input symbol the comment is about, or null for the whole budget. */
    symbol: text('symbol'),
    /** The root comment of the thread a reply belongs to (same budget), or null for a thread's first comment. */
    parentId: integer('parent_id').references((): AnySQLiteColumn => comments.id),
    authorId: integer('author_id')
      .notNull()
      .references(() => users.id),
    body: text('body').notNull(),
    resolved: integer('resolved', { mode: 'boolean' }).notNull().default(false),
    resolvedBy: integer('resolved_by').references(() => users.id),
    resolvedAt: integer('resolved_at'),
    createdAt: integer('created_at').notNull().default(now),
  },
  (t) => [index('comments_budget_idx').on(t.budgetId), index('comments_parent_idx').on(t.parentId)],
);

export const attachments = sqliteTable(
  'attachments',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    budgetId: integer('budget_id')
      .notNull()
      .references(() => budgets.id),
    /** The version the evidence was added to; it belongs to that version and every later one. */
    versionNumber: integer('version_number').notNull().default(1),
    /** Input symbol the evidence is about, or null for the whole budget. */
    symbol: text('symbol'),
    fileName: text('file_name').notNull(),
    size: integer('size').notNull(),
    sha256: text('sha256').notNull(),
    mediaType: text('media_type').notNull(),
    uploadedBy: integer('uploaded_by')
      .notNull()
      .references(() => users.id),
    createdAt: integer('created_at').notNull().default(now),
  },
  (t) => [index('attachments_budget_idx').on(t.budgetId)],
);

/**
 * Review decisions on a version: an approval with the reason given for signing over open
 * comments or an unvalidated result, or a return to draft with the reviewer's reason.
 */
export const reviewDecisions = sqliteTable(
  'review_decisions',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    budgetId: integer('budget_id')
      .notNull()
      .references(() => budgets.id),
    versionNumber: integer('version_number').notNull(),
    decision: text('decision', { enum: ['approved', 'returned'] }).notNull(),
    actorId: integer('actor_id')
      .notNull()
      .references(() => users.id),
    /** Why: required for a return, and for an approval over open threads or a result Monte Carlo did not validate. */
    reason: text('reason'),
    /** Open comment threads at the moment of the decision. */
    openThreads: integer('open_threads').notNull().default(0),
    /** The JCGM 101 clause 8 verdict of the stored result at that moment, or null when there was none. */
    validationVerdict: text('validation_verdict'),
    at: integer('at').notNull().default(now),
  },
  (t) => [index('review_decisions_budget_idx').on(t.budgetId, t.versionNumber)],
);

export const auditEvents = sqliteTable(
  'audit_events',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    at: integer('at').notNull().default(now),
    actorId: integer('actor_id').references(() => users.id),
    action: text('action').notNull(),
    budgetId: integer('budget_id'),
    versionNumber: integer('version_number'),
    /** JSON object with the particulars of the event. */
    detail: text('detail').notNull().default('{}'),
    /**
     * SHA-256 (hex) chaining this event to the one before it (server/audit/audit-chain.ts).
     * Null only for events written before the chain existed, until the server seals them at start.
     */
    hash: text('hash'),
  },
  (t) => [index('audit_budget_idx').on(t.budgetId), index('audit_actor_idx').on(t.actorId), index('audit_at_idx').on(t.at)],
);

/** One-time tokens for invitations and password resets; only their SHA-256 is stored. */
export const accountTokens = sqliteTable('account_tokens', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  kind: text('kind', { enum: ['invitation', 'password_reset'] }).notNull(),
  userId: integer('user_id')
    .notNull()
    .references(() => users.id),
  tokenHash: text('token_hash').notNull().unique(),
  expiresAt: integer('expires_at').notNull(),
  usedAt: integer('used_at'),
  createdAt: integer('created_at').notNull().default(now),
});

/** Every message the server sent. */
export const outbox = sqliteTable('outbox', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  at: integer('at').notNull().default(now),
  sender: text('sender').notNull(),
  recipients: text('recipients').notNull(),
  subject: text('subject').notNull(),
  text: text('text').notNull(),
  raw: text('raw'),
});
