/**
 * An organisation's API keys and its history: the request to create a key and the answers of the key and
 * history routes (zod schemas, so that the API document can be generated from them).
 */
import { z } from "./zod";
import { name } from "./common";
import { id, instant, nextCursor } from "./wire";
import { KEY_SCOPES, type KeyScope } from "@/lib/auth/route-table";

/** Every key starts with this, so that a leaked key is recognisable (e.g. by secret scanners). */
export const API_KEY_PREFIX = "pnr_";
/** How many characters of a key (prefix included) are kept in the clear for the key list. */
export const API_KEY_START_LENGTH = 10;

export const keyScopeSchema = z.enum(KEY_SCOPES, { error: `scope must be one of ${KEY_SCOPES.join(", ")}` });

/** What each scope allows, in one line (the owners' page and the documentation). */
export const KEY_SCOPE_SUMMARIES: Record<KeyScope, string> = {
  read: "Reads projects, results, revisions, workbooks and the library (GET routes only).",
  calculate: "Everything a read key may do, plus the glazing and schedule calculations.",
  "read-write": "Everything its owner may do through the API, except managing keys, members and invitations.",
};

export const ApiKeyCreateRequest = z.object({
  name: name("name", 80),
  scope: keyScopeSchema,
});
export type ApiKeyCreateRequest = z.infer<typeof ApiKeyCreateRequest>;

/** A key as the list shows it: never the key itself. */
export const ApiKeyEntry = z.object({
  id,
  name: z.string(),
  scope: keyScopeSchema,
  start: z.string().describe("The first characters of the key, to recognise it"),
  createdByName: z.string().describe("The owner who made the key (the key acts as them)"),
  createdAt: instant,
  lastUsedAt: instant.nullable().describe("Updated at most once a minute; null until first used"),
  revokedAt: instant.nullable().describe("null while the key works"),
});
export type ApiKeyEntry = z.infer<typeof ApiKeyEntry>;

/** GET /api/v1/orgs/:orgId/api-keys: one page of the organisation's keys, newest first, revoked ones included. */
export const ApiKeyListResponse = z.object({ apiKeys: z.array(ApiKeyEntry), nextCursor });
export type ApiKeyListResponse = z.infer<typeof ApiKeyListResponse>;

/** POST /api/v1/orgs/:orgId/api-keys (201): the new key, with the secret `key` shown this once. */
export const ApiKeyCreatedResponse = z.object({
  apiKey: ApiKeyEntry,
  key: z.string().startsWith(API_KEY_PREFIX).describe("The key itself: shown this once, stored only as a hash"),
});
export type ApiKeyCreatedResponse = z.infer<typeof ApiKeyCreatedResponse>;

/** DELETE /api/v1/orgs/:orgId/api-keys/:id: the revoked key (revokedAt set). */
export const ApiKeyRevokedResponse = z.object({ apiKey: ApiKeyEntry });
export type ApiKeyRevokedResponse = z.infer<typeof ApiKeyRevokedResponse>;

/** One event of the organisation's history. */
export const OrganizationEventEntry = z.object({
  id,
  kind: z.string().describe("What happened, e.g. api-key.created, api-key.revoked"),
  summary: z.string(),
  actorName: z.string(),
  createdAt: instant,
});
export type OrganizationEventEntry = z.infer<typeof OrganizationEventEntry>;

/** GET /api/v1/orgs/:orgId/history: one page of events, newest first. */
export const OrganizationHistoryResponse = z.object({ events: z.array(OrganizationEventEntry), nextCursor });
export type OrganizationHistoryResponse = z.infer<typeof OrganizationHistoryResponse>;
