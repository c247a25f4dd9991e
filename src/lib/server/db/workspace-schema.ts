/**
 * A project's working state: candidate make-ups per façade (options), the brief's requirements, the
 * architect's comments and decisions, issued schedule revisions, the project's history, and the cache
 * of computed results.
 */
import { relations, sql } from "drizzle-orm";
import { index, integer, jsonb, pgTable, text, timestamp, unique, uniqueIndex, check, type AnyPgColumn } from "drizzle-orm/pg-core";
import { user } from "./auth-schema";
import { facade, project } from "./app-schema";
import { makeup, makeupRevision } from "./library-schema";
import { createdAt, eventColumns, id, updatedAt } from "./columns";

export const OPTION_STATUSES = ["proposed", "approved", "rejected"] as const;
export type OptionStatus = (typeof OPTION_STATUSES)[number];

/**
 * A candidate make-up for one façade, named by the consultant. It points at one make-up revision; a
 * make-up in use cannot be deleted (restrict), so no option is ever left dangling. At most one option
 * per façade is approved.
 */
export const facadeOption = pgTable(
  "facade_option",
  {
    id: id(),
    projectId: text("project_id")
      .notNull()
      .references(() => project.id, { onDelete: "cascade" }),
    facadeId: text("facade_id")
      .notNull()
      .references(() => facade.id, { onDelete: "cascade" }),
    makeupId: text("makeup_id")
      .notNull()
      .references(() => makeup.id, { onDelete: "restrict" }),
    makeupRevisionId: text("makeup_revision_id")
      .notNull()
      .references(() => makeupRevision.id, { onDelete: "restrict" }),
    name: text("name").notNull(),
    position: integer("position").notNull().default(0),
    status: text("status", { enum: OPTION_STATUSES }).notNull().default("proposed"),
    /** Optimistic concurrency: PATCH sends the version it read; a stale one answers 409. */
    version: integer("version").notNull().default(1),
    createdById: text("created_by_id").references(() => user.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    index("facade_option_project_idx").on(t.projectId),
    index("facade_option_facade_idx").on(t.facadeId, t.position),
    index("facade_option_makeup_idx").on(t.makeupId),
    uniqueIndex("facade_option_one_approved")
      .on(t.facadeId)
      .where(sql`${t.status} = 'approved'`),
    check("facade_option_status", sql`${t.status} in ('proposed', 'approved', 'rejected')`),
  ],
);

/**
 * The brief's limits for a project, with per-façade overrides:
 * { project: Limits, facades: { [facadeId]: Limits } }, Limits as the requirements contract says.
 */
export const projectRequirements = pgTable("project_requirements", {
  projectId: text("project_id")
    .primaryKey()
    .references(() => project.id, { onDelete: "cascade" }),
  limits: jsonb("limits").notNull(),
  version: integer("version").notNull().default(1),
  updatedById: text("updated_by_id").references(() => user.id, { onDelete: "set null" }),
  updatedAt: updatedAt(),
});

/** A comment on an option; `parentId` makes threads. */
export const optionComment = pgTable(
  "option_comment",
  {
    id: id(),
    optionId: text("option_id")
      .notNull()
      .references(() => facadeOption.id, { onDelete: "cascade" }),
    parentId: text("parent_id").references((): AnyPgColumn => optionComment.id, { onDelete: "cascade" }),
    authorId: text("author_id").references(() => user.id, { onDelete: "set null" }),
    /** Kept so the thread still names its author if the account goes. */
    authorName: text("author_name").notNull(),
    body: text("body").notNull(),
    createdAt: createdAt(),
  },
  (t) => [index("option_comment_option_idx").on(t.optionId, t.createdAt)],
);

/** Every approval or rejection, newest last; the option's `status` is the latest one. */
export const optionDecision = pgTable(
  "option_decision",
  {
    id: id(),
    optionId: text("option_id")
      .notNull()
      .references(() => facadeOption.id, { onDelete: "cascade" }),
    decision: text("decision", { enum: ["approved", "rejected"] }).notNull(),
    note: text("note"),
    decidedById: text("decided_by_id").references(() => user.id, { onDelete: "set null" }),
    decidedByName: text("decided_by_name").notNull(),
    createdAt: createdAt(),
  },
  (t) => [index("option_decision_option_idx").on(t.optionId, t.createdAt)],
);

/**
 * An issued glazing schedule: immutable, lettered A, B, C … per project (`sequence` 1, 2, 3 …), a
 * snapshot of every approved option's make-up revision, values and results at issue time.
 */
export const scheduleRevision = pgTable(
  "schedule_revision",
  {
    id: id(),
    projectId: text("project_id")
      .notNull()
      .references(() => project.id, { onDelete: "cascade" }),
    sequence: integer("sequence").notNull(),
    letter: text("letter").notNull(),
    note: text("note"),
    issuedById: text("issued_by_id").references(() => user.id, { onDelete: "set null" }),
    issuedByName: text("issued_by_name").notNull(),
    issuedAt: timestamp("issued_at", { withTimezone: true }).defaultNow().notNull(),
    snapshot: jsonb("snapshot").notNull(),
  },
  (t) => [unique("schedule_revision_sequence").on(t.projectId, t.sequence), unique("schedule_revision_letter").on(t.projectId, t.letter)],
);

/** The project's history: who did what, when. */
export const projectEvent = pgTable(
  "project_event",
  {
    id: id(),
    projectId: text("project_id")
      .notNull()
      .references(() => project.id, { onDelete: "cascade" }),
    ...eventColumns(),
  },
  (t) => [index("project_event_project_idx").on(t.projectId, t.createdAt.desc(), t.id)],
);

/**
 * Computed results keyed by the SHA-256 of everything that enters them (make-up revision layers,
 * façade, site, sky, year, engine version); rows of a project are dropped when its inputs change.
 */
export const resultCache = pgTable(
  "result_cache",
  {
    key: text("key").primaryKey(),
    projectId: text("project_id")
      .notNull()
      .references(() => project.id, { onDelete: "cascade" }),
    value: jsonb("value").notNull(),
    createdAt: createdAt(),
  },
  (t) => [index("result_cache_project_idx").on(t.projectId)],
);

export const facadeOptionRelations = relations(facadeOption, ({ one, many }) => ({
  project: one(project, { fields: [facadeOption.projectId], references: [project.id] }),
  facade: one(facade, { fields: [facadeOption.facadeId], references: [facade.id] }),
  makeup: one(makeup, { fields: [facadeOption.makeupId], references: [makeup.id] }),
  makeupRevision: one(makeupRevision, { fields: [facadeOption.makeupRevisionId], references: [makeupRevision.id] }),
  comments: many(optionComment),
  decisions: many(optionDecision),
}));
export const optionCommentRelations = relations(optionComment, ({ one }) => ({
  option: one(facadeOption, { fields: [optionComment.optionId], references: [facadeOption.id] }),
}));
export const optionDecisionRelations = relations(optionDecision, ({ one }) => ({
  option: one(facadeOption, { fields: [optionDecision.optionId], references: [facadeOption.id] }),
}));

export type FacadeOption = typeof facadeOption.$inferSelect;
export type OptionComment = typeof optionComment.$inferSelect;
export type OptionDecision = typeof optionDecision.$inferSelect;
export type ScheduleRevision = typeof scheduleRevision.$inferSelect;
export type ProjectEvent = typeof projectEvent.$inferSelect;
