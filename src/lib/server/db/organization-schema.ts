/**
 * What belongs to an organisation as a whole: its API keys (for scripts and integrations) and its history
 * (who changed what and when, e.g. a key created or revoked).
 */
import { check, index, pgTable, text, timestamp } from "drizzle-orm/pg-core";
import { sql } from "drizzle-orm";
import { organization, user } from "./auth-schema";
import { createdAt, eventColumns, id } from "./columns";

/**
 * An organisation's API key. Only the SHA-256 of the key is stored (`key_hash`, hex); `start` keeps the
 * first characters so that owners recognise a key in the list. A revoked key keeps its row (revoked_at set).
 */
export const orgApiKey = pgTable(
  "org_api_key",
  {
    id: id(),
    organizationId: text("organization_id")
      .notNull()
      .references(() => organization.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    /** "read", "calculate" or "read-write" (lib/auth/route-table.ts, KEY_SCOPES). */
    scope: text("scope").notNull(),
    keyHash: text("key_hash").notNull().unique(),
    start: text("start").notNull(),
    /** The owner who made the key; the key acts as this member. */
    createdById: text("created_by_id").references(() => user.id, { onDelete: "set null" }),
    createdByName: text("created_by_name").notNull(),
    createdAt: createdAt(),
    lastUsedAt: timestamp("last_used_at", { withTimezone: true }),
    revokedAt: timestamp("revoked_at", { withTimezone: true }),
  },
  (t) => [
    index("org_api_key_org_idx").on(t.organizationId, t.createdAt.desc(), t.id),
    check("org_api_key_scope_check", sql`${t.scope} in ('read', 'calculate', 'read-write')`),
  ],
);

/** The organisation's history; services write an event in the same transaction as the change it records. */
export const organizationEvent = pgTable(
  "organization_event",
  {
    id: id(),
    organizationId: text("organization_id")
      .notNull()
      .references(() => organization.id, { onDelete: "cascade" }),
    ...eventColumns(),
  },
  (t) => [index("organization_event_org_idx").on(t.organizationId, t.createdAt.desc(), t.id)],
);

export type OrgApiKey = typeof orgApiKey.$inferSelect;
export type OrganizationEvent = typeof organizationEvent.$inferSelect;
