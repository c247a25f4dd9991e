/**
 * Paneray's own tables. Organisations, users, memberships (with their role) and
 * invitations are better-auth's tables in auth-schema.ts.
 */
import { relations, sql } from "drizzle-orm";
import { doublePrecision, index, integer, jsonb, pgTable, primaryKey, text, timestamp, check } from "drizzle-orm/pg-core";
import { member, organization, user } from "./auth-schema";
import { createdAt, id, updatedAt } from "./columns";

/** A building studied for one organisation: its site fixes the sun, its façades the orientations. */
export const project = pgTable(
  "project",
  {
    id: id(),
    organizationId: text("organization_id")
      .notNull()
      .references(() => organization.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    /** The firm's own job number, free text. */
    reference: text("reference"),
    buildingName: text("building_name"),
    siteName: text("site_name").notNull(),
    latitudeDeg: doublePrecision("latitude_deg").notNull(),
    longitudeDeg: doublePrecision("longitude_deg").notNull(),
    /** IANA time-zone name of the site, e.g. Europe/Lisbon. */
    timeZone: text("time_zone").notNull(),
    elevationM: doublePrecision("elevation_m").notNull().default(0),
    /** Ground reflectance in front of the façades, 0–1. */
    groundAlbedo: doublePrecision("ground_albedo").notNull().default(0.2),
    /** Sky-diffuse model of the schedules: "perez", "hay-davies" or "isotropic". */
    skyModel: text("sky_model", { enum: ["perez", "hay-davies", "isotropic"] })
      .notNull()
      .default("perez"),
    /** Twelve monthly Linke turbidity values (January first); null = the engine's default. */
    linkeTurbidity: jsonb("linke_turbidity").$type<number[]>(),
    description: text("description"),
    createdById: text("created_by_id").references(() => user.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    index("project_organization_idx").on(t.organizationId),
    /** The projects list's order (most recently changed first, ties by id) within an organisation: pages read it in order. */
    index("project_organization_updated_idx").on(t.organizationId, t.updatedAt.desc().nullsFirst(), t.id),
    check("project_latitude_range", sql`${t.latitudeDeg} between -90 and 90`),
    check("project_longitude_range", sql`${t.longitudeDeg} between -180 and 180`),
  ],
);

/** One orientation of a building's envelope: the outward normal's azimuth and the tilt from horizontal. */
export const facade = pgTable(
  "facade",
  {
    id: id(),
    projectId: text("project_id")
      .notNull()
      .references(() => project.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    /** Azimuth of the outward normal, degrees clockwise from north, [0, 360). */
    azimuthDeg: doublePrecision("azimuth_deg").notNull(),
    /** Tilt from horizontal, degrees: 90 = vertical wall, 0 = flat roof light. */
    tiltDeg: doublePrecision("tilt_deg").notNull().default(90),
    /** Glazed area of the whole façade, m², for W and kWh totals; null = per m² only. */
    glazedAreaM2: doublePrecision("glazed_area_m2"),
    /** The typical window the shading devices are drawn around, m. */
    windowWidthM: doublePrecision("window_width_m"),
    windowHeightM: doublePrecision("window_height_m"),
    /** Shading devices as the schedule engine takes them, without the window: { overhang?, fins?, horizonDeg? }. */
    shading: jsonb("shading").$type<{ overhang?: unknown; fins?: unknown; horizonDeg?: number }>(),
    position: integer("position").notNull().default(0),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    index("facade_project_idx").on(t.projectId),
    check("facade_azimuth_range", sql`${t.azimuthDeg} >= 0 and ${t.azimuthDeg} < 360`),
    check("facade_tilt_range", sql`${t.tiltDeg} between 0 and 180`),
  ],
);

/** A project made visible to one member (clients see only these). */
export const projectShare = pgTable(
  "project_share",
  {
    projectId: text("project_id")
      .notNull()
      .references(() => project.id, { onDelete: "cascade" }),
    memberId: text("member_id")
      .notNull()
      .references(() => member.id, { onDelete: "cascade" }),
    sharedById: text("shared_by_id").references(() => user.id, { onDelete: "set null" }),
    createdAt: createdAt(),
  },
  (t) => [primaryKey({ columns: [t.projectId, t.memberId] }), index("project_share_member_idx").on(t.memberId)],
);

export const projectRelations = relations(project, ({ one, many }) => ({
  organization: one(organization, { fields: [project.organizationId], references: [organization.id] }),
  facades: many(facade),
  shares: many(projectShare),
}));

export const facadeRelations = relations(facade, ({ one }) => ({
  project: one(project, { fields: [facade.projectId], references: [project.id] }),
}));

export const projectShareRelations = relations(projectShare, ({ one }) => ({
  project: one(project, { fields: [projectShare.projectId], references: [project.id] }),
  member: one(member, { fields: [projectShare.memberId], references: [member.id] }),
}));

export type Project = typeof project.$inferSelect;
export type Facade = typeof facade.$inferSelect;

/**
 * Fixed-window counters of the authentication limits (attempts per client address, failed sign-ins per
 * account), kept in the database so that every web server counts the same attempts.
 */
export const authRateLimit = pgTable("auth_rate_limit", {
  /** What is counted and for whom, e.g. "sign-in:ip:203.0.113.7" or "sign-in-failed:email:a@b.example". */
  key: text("key").primaryKey(),
  count: integer("count").notNull(),
  windowStartedAt: timestamp("window_started_at", { withTimezone: true }).notNull(),
});
