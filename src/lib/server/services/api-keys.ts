/**
 * An organisation's API keys: made, listed and revoked by its owners, checked on every request that carries
 * `Authorization: Bearer pnr_…`.
 *
 * A key is `pnr_` and 32 random bytes in base64url (43 characters). Only its SHA-256 is stored, so a lookup
 * is one indexed query on the hash (no comparison of secrets in JavaScript, hence no timing to protect).
 * A key acts as the owner who made it, while that person is still a member of the organisation with the
 * right to manage keys; otherwise (they left, or are no longer an owner) the key stops working.
 * Nothing about keys is cached: a revoked key is refused by the very next request.
 */
import { createHash, randomBytes } from "node:crypto";
import { and, eq, isNull, lt, or, sql } from "drizzle-orm";
import { db } from "@/lib/server/db/client";
import { member, orgApiKey, user, type OrgApiKey } from "@/lib/server/db/schema";
import { ConflictError, NotFoundError } from "@/lib/server/errors";
import { serverEnv } from "@/lib/server/env";
import { hit } from "@/lib/server/rate-limit";
import { roleCan } from "@/lib/auth/roles";
import type { KeyScope } from "@/lib/auth/route-table";
import { API_KEY_PREFIX, API_KEY_START_LENGTH, type ApiKeyCreateRequest, type ApiKeyEntry } from "@/lib/contracts/api-keys";
import { pageOf, type Page, type PageQuery } from "@/lib/contracts/pagination";
import { instantKey, newestFirst, olderThanCursor } from "@/lib/server/db/newest-first";
import type { Actor } from "./history";
import { recordOrgEvent } from "./org-history";

/** The shape of every key this module makes; anything else is refused without a database query. */
const KEY_SHAPE = /^pnr_[A-Za-z0-9_-]{43}$/;

export const hashApiKey = (key: string) => createHash("sha256").update(key, "utf8").digest("hex");

/** A new key: the prefix and 32 random bytes. */
export const newApiKey = () => API_KEY_PREFIX + randomBytes(32).toString("base64url");

/** The key a request authenticates with, as the endpoints see it in `locals.apiKey`. */
export interface ApiKeyPrincipal {
  id: string;
  name: string;
  organizationId: string;
  scope: KeyScope;
}

export type UserRow = typeof user.$inferSelect;

export type KeyCheck =
  { kind: "ok"; user: UserRow; apiKey: ApiKeyPrincipal } | { kind: "invalid" } | { kind: "limited"; retryAfterSeconds: number; limit: number };

/** The per-key request limit: one fixed window of a minute, shared by every server through PostgreSQL. */
export const apiKeyLimit = () => ({ name: "api-key", max: serverEnv().API_KEY_RATE_LIMIT, windowSeconds: 60 });

/** How often the last-use time is written (at most once per key in this many seconds). */
const LAST_USED_RESOLUTION_SECONDS = 60;

/**
 * Checks a presented key: unknown, malformed or revoked keys, and keys whose maker is no longer an owner of
 * the organisation, are "invalid"; a key past its limit is "limited". Records the last use.
 */
export async function authenticateApiKey(presented: string): Promise<KeyCheck> {
  if (!KEY_SHAPE.test(presented)) return { kind: "invalid" };
  const [row] = await db
    .select({ key: orgApiKey, role: member.role, user })
    .from(orgApiKey)
    .innerJoin(member, and(eq(member.organizationId, orgApiKey.organizationId), eq(member.userId, orgApiKey.createdById)))
    .innerJoin(user, eq(user.id, orgApiKey.createdById))
    .where(and(eq(orgApiKey.keyHash, hashApiKey(presented)), isNull(orgApiKey.revokedAt)));
  if (!row || !roleCan(row.role, { apiKey: ["manage"] })) return { kind: "invalid" };
  const rule = apiKeyLimit();
  const counted = await hit(rule, row.key.id);
  if (!counted.allowed) return { kind: "limited", retryAfterSeconds: counted.retryAfterSeconds, limit: rule.max };
  const stale = row.key.lastUsedAt === null || Date.now() - row.key.lastUsedAt.getTime() >= LAST_USED_RESOLUTION_SECONDS * 1000;
  if (stale) {
    await db
      .update(orgApiKey)
      .set({ lastUsedAt: sql`now()` })
      .where(
        and(
          eq(orgApiKey.id, row.key.id),
          or(isNull(orgApiKey.lastUsedAt), lt(orgApiKey.lastUsedAt, sql`now() - make_interval(secs => ${LAST_USED_RESOLUTION_SECONDS})`)),
        ),
      );
  }
  return {
    kind: "ok",
    user: row.user,
    apiKey: { id: row.key.id, name: row.key.name, organizationId: row.key.organizationId, scope: row.key.scope as KeyScope },
  };
}

const iso = (d: Date | null) => (d ? d.toISOString() : null);

export const apiKeyEntry = (k: OrgApiKey): ApiKeyEntry => ({
  id: k.id,
  name: k.name,
  scope: k.scope as KeyScope,
  start: k.start,
  createdByName: k.createdByName,
  createdAt: k.createdAt.toISOString(),
  lastUsedAt: iso(k.lastUsedAt),
  revokedAt: iso(k.revokedAt),
});

/** Makes a key; the key itself is returned this once and never stored. The history records it. */
export async function createApiKey(organizationId: string, actor: Actor, input: ApiKeyCreateRequest): Promise<{ apiKey: ApiKeyEntry; key: string }> {
  const key = newApiKey();
  return db.transaction(async (tx) => {
    const [row] = await tx
      .insert(orgApiKey)
      .values({
        organizationId,
        name: input.name,
        scope: input.scope,
        keyHash: hashApiKey(key),
        start: key.slice(0, API_KEY_START_LENGTH),
        createdById: actor.id,
        createdByName: actor.name,
      })
      .returning();
    await recordOrgEvent(tx, {
      organizationId,
      actor,
      kind: "api-key.created",
      summary: `Created the API key “${input.name}” (${input.scope})`,
      detail: { apiKeyId: row!.id, name: input.name, scope: input.scope, start: row!.start },
    });
    return { apiKey: apiKeyEntry(row!), key };
  });
}

/** Revokes a key of the organisation at once (its row stays, with revoked_at). The history records it. */
export async function revokeApiKey(organizationId: string, apiKeyId: string, actor: Actor): Promise<ApiKeyEntry> {
  return db.transaction(async (tx) => {
    const [row] = await tx
      .update(orgApiKey)
      .set({ revokedAt: sql`now()` })
      .where(and(eq(orgApiKey.id, apiKeyId), eq(orgApiKey.organizationId, organizationId), isNull(orgApiKey.revokedAt)))
      .returning();
    if (!row) {
      const [existing] = await tx
        .select({ id: orgApiKey.id })
        .from(orgApiKey)
        .where(and(eq(orgApiKey.id, apiKeyId), eq(orgApiKey.organizationId, organizationId)));
      if (!existing) throw new NotFoundError("No such API key in this organisation");
      throw new ConflictError("This API key has already been revoked");
    }
    await recordOrgEvent(tx, {
      organizationId,
      actor,
      kind: "api-key.revoked",
      summary: `Revoked the API key “${row.name}” (${row.scope})`,
      detail: { apiKeyId: row.id, name: row.name, scope: row.scope, start: row.start },
    });
    return apiKeyEntry(row);
  });
}

/** One page of the organisation's keys, newest first, revoked ones included. */
export async function apiKeysOf(organizationId: string, q: PageQuery): Promise<Page<ApiKeyEntry>> {
  const after = olderThanCursor(orgApiKey.createdAt, orgApiKey.id, q.cursor);
  const rows = await db
    .select({ k: orgApiKey, key: instantKey(orgApiKey.createdAt) })
    .from(orgApiKey)
    .where(and(eq(orgApiKey.organizationId, organizationId), after))
    .orderBy(...newestFirst(orgApiKey.createdAt, orgApiKey.id))
    .limit(q.limit + 1);
  const page = pageOf(rows, q.limit, (r) => ({ key: r.key, id: r.k.id }));
  return { items: page.items.map((r) => apiKeyEntry(r.k)), nextCursor: page.nextCursor };
}
