/** Column helpers every table of ours shares: a random UUID primary key, the two timestamps, and the columns of a history event. */
import { jsonb, text, timestamp } from "drizzle-orm/pg-core";
import { user } from "./auth-schema";

export const id = () =>
  text("id")
    .primaryKey()
    .$defaultFn(() => crypto.randomUUID());

export const createdAt = () => timestamp("created_at", { withTimezone: true }).defaultNow().notNull();

/** Set on insert and moved on by every update made through Drizzle. */
export const updatedAt = () =>
  timestamp("updated_at", { withTimezone: true })
    .defaultNow()
    .$onUpdate(() => new Date())
    .notNull();

/**
 * The columns of one event of a history (a project's, an organisation's): who did it (the name kept as it was then,
 * the account may go), what kind of change, one readable sentence, details, when. Services write an event in the
 * same transaction as the change it records.
 */
export const eventColumns = () => ({
  actorId: text("actor_id").references(() => user.id, { onDelete: "set null" }),
  actorName: text("actor_name").notNull(),
  /** e.g. "option.approved", "api-key.created". */
  kind: text("kind").notNull(),
  /** One readable sentence, e.g. "Approved “Clear triple” for North". */
  summary: text("summary").notNull(),
  detail: jsonb("detail"),
  createdAt: createdAt(),
});
