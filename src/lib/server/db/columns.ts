/** Column helpers every table of ours shares: a random UUID primary key and the two timestamps. */
import { text, timestamp } from "drizzle-orm/pg-core";

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
