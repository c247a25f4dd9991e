/**
 * An organisation's glazing library: saved panes and make-ups. Every edit of an item writes a new
 * revision row and moves the item's `revision` on; options of projects point at a make-up revision, so
 * an issued schedule keeps the make-up it was issued with however the library changes later.
 */
import { relations } from "drizzle-orm";
import { index, integer, jsonb, pgTable, text, unique } from "drizzle-orm/pg-core";
import { organization, user } from "./auth-schema";
import { createdAt, id, updatedAt } from "./columns";

/** A saved pane; its current content is the revision numbered `revision`. */
export const libraryPane = pgTable(
  "library_pane",
  {
    id: id(),
    organizationId: text("organization_id")
      .notNull()
      .references(() => organization.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    /** The current revision number, 1 for a new pane. */
    revision: integer("revision").notNull().default(1),
    createdById: text("created_by_id").references(() => user.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("library_pane_organization_idx").on(t.organizationId, t.name)],
);

/** One state of a saved pane: the pane layer as POST /api/v1/calc/glazing takes it, and the user's note. */
export const libraryPaneRevision = pgTable(
  "library_pane_revision",
  {
    id: id(),
    paneId: text("pane_id")
      .notNull()
      .references(() => libraryPane.id, { onDelete: "cascade" }),
    revision: integer("revision").notNull(),
    name: text("name").notNull(),
    /** The pane layer (kind "pane"), glass properties or measured values. */
    layer: jsonb("layer").notNull(),
    /** Free text, e.g. the maker's data-sheet reference. */
    note: text("note"),
    createdById: text("created_by_id").references(() => user.id, { onDelete: "set null" }),
    createdAt: createdAt(),
  },
  (t) => [unique("library_pane_revision_unique").on(t.paneId, t.revision)],
);

/** A saved glazing make-up (panes and gaps, outdoors first); its current content is revision `revision`. */
export const makeup = pgTable(
  "makeup",
  {
    id: id(),
    organizationId: text("organization_id")
      .notNull()
      .references(() => organization.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    revision: integer("revision").notNull().default(1),
    createdById: text("created_by_id").references(() => user.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("makeup_organization_idx").on(t.organizationId, t.name)],
);

/**
 * One state of a make-up: its layers as POST /api/v1/calc/glazing takes them, the description generated
 * from them (e.g. "6 | 16 Ar 90% | 4 low-e"), and the values computed when it was saved.
 */
export const makeupRevision = pgTable(
  "makeup_revision",
  {
    id: id(),
    makeupId: text("makeup_id")
      .notNull()
      .references(() => makeup.id, { onDelete: "cascade" }),
    revision: integer("revision").notNull(),
    name: text("name").notNull(),
    description: text("description").notNull(),
    layers: jsonb("layers").notNull(),
    note: text("note"),
    /** { normal: GlazingValues, hemispherical: GlazingValues, uValue, warnings } at save time. */
    values: jsonb("values").notNull(),
    createdById: text("created_by_id").references(() => user.id, { onDelete: "set null" }),
    createdAt: createdAt(),
  },
  (t) => [unique("makeup_revision_unique").on(t.makeupId, t.revision)],
);

export const libraryPaneRelations = relations(libraryPane, ({ one, many }) => ({
  organization: one(organization, { fields: [libraryPane.organizationId], references: [organization.id] }),
  revisions: many(libraryPaneRevision),
}));
export const libraryPaneRevisionRelations = relations(libraryPaneRevision, ({ one }) => ({
  pane: one(libraryPane, { fields: [libraryPaneRevision.paneId], references: [libraryPane.id] }),
}));
export const makeupRelations = relations(makeup, ({ one, many }) => ({
  organization: one(organization, { fields: [makeup.organizationId], references: [organization.id] }),
  revisions: many(makeupRevision),
}));
export const makeupRevisionRelations = relations(makeupRevision, ({ one }) => ({
  makeup: one(makeup, { fields: [makeupRevision.makeupId], references: [makeup.id] }),
}));

export type LibraryPane = typeof libraryPane.$inferSelect;
export type LibraryPaneRevision = typeof libraryPaneRevision.$inferSelect;
export type Makeup = typeof makeup.$inferSelect;
export type MakeupRevision = typeof makeupRevision.$inferSelect;
