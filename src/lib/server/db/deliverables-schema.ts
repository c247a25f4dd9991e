/**
 * What the consultant brings in and what the design team receives: uploaded files (kept as sent, with their
 * SHA-256), a project's measured weather series, and e-mail deliveries of issued workbooks (the outbox).
 */
import { customType, index, integer, jsonb, pgTable, text, timestamp } from "drizzle-orm/pg-core";
import { organization, user } from "./auth-schema";
import { project } from "./app-schema";
import { scheduleRevision } from "./workspace-schema";
import { createdAt, id, updatedAt } from "./columns";

/** Raw bytes (PostgreSQL bytea) as a Node Buffer. */
export const bytea = customType<{ data: Buffer; driverData: Buffer }>({
  dataType: () => "bytea",
});

/** An uploaded file as it was sent: measured panes for the library, or a project's weather series. */
export const upload = pgTable(
  "upload",
  {
    id: id(),
    organizationId: text("organization_id")
      .notNull()
      .references(() => organization.id, { onDelete: "cascade" }),
    /** Set for a project's files (weather); null for the library's (panes). */
    projectId: text("project_id").references(() => project.id, { onDelete: "cascade" }),
    /** "panes" | "weather" */
    kind: text("kind").notNull(),
    fileName: text("file_name").notNull(),
    contentType: text("content_type").notNull(),
    sizeBytes: integer("size_bytes").notNull(),
    sha256: text("sha256").notNull(),
    content: bytea("content").notNull(),
    /** Data rows the file held (header excluded). */
    rowCount: integer("row_count").notNull(),
    /** What was saved from it, e.g. { paneIds: [...] } or { from, to, hours }. */
    summary: jsonb("summary").notNull(),
    createdById: text("created_by_id").references(() => user.id, { onDelete: "set null" }),
    createdByName: text("created_by_name").notNull(),
    createdAt: createdAt(),
  },
  (t) => [index("upload_org_idx").on(t.organizationId, t.createdAt), index("upload_project_idx").on(t.projectId, t.createdAt)],
);

/**
 * A project's measured weather, used by its results and workbooks in place of the clear-sky model. One series a
 * project (a new upload replaces it); the period is the file's. Columns are parallel arrays, one entry an hour.
 */
export const weatherSeries = pgTable("weather_series", {
  projectId: text("project_id")
    .primaryKey()
    .references(() => project.id, { onDelete: "cascade" }),
  uploadId: text("upload_id")
    .notNull()
    .references(() => upload.id, { onDelete: "cascade" }),
  /** First and last instant of the series. */
  fromTime: timestamp("from_time", { withTimezone: true }).notNull(),
  toTime: timestamp("to_time", { withTimezone: true }).notNull(),
  stepMinutes: integer("step_minutes").notNull(),
  /** { time: ISO-8601 instants, ghiWm2, dniWm2, dhiWm2, airTemperatureC (numbers or null) } */
  series: jsonb("series").notNull(),
  hours: integer("hours").notNull(),
  createdAt: createdAt(),
});

/** An e-mail of an issued revision's workbook to the design team; the job queue sends it, with retries. */
export const delivery = pgTable(
  "delivery",
  {
    id: id(),
    projectId: text("project_id")
      .notNull()
      .references(() => project.id, { onDelete: "cascade" }),
    organizationId: text("organization_id")
      .notNull()
      .references(() => organization.id, { onDelete: "cascade" }),
    revisionId: text("revision_id")
      .notNull()
      .references(() => scheduleRevision.id, { onDelete: "cascade" }),
    revisionLetter: text("revision_letter").notNull(),
    /** [{ email, name?, memberId? }] */
    recipients: jsonb("recipients").notNull(),
    message: text("message"),
    /** "queued" | "sending" | "sent" | "failed" */
    status: text("status").notNull().default("queued"),
    attempts: integer("attempts").notNull().default(0),
    /** The SMTP error of the last failed attempt. */
    lastError: text("last_error"),
    /** The queue's job id. */
    jobId: text("job_id"),
    /** The exact workbook attached, kept once it is built. */
    attachmentName: text("attachment_name"),
    attachment: bytea("attachment"),
    attachmentSha256: text("attachment_sha256"),
    /** The Message-ID the SMTP server accepted. */
    messageId: text("message_id"),
    createdById: text("created_by_id").references(() => user.id, { onDelete: "set null" }),
    createdByName: text("created_by_name").notNull(),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    sentAt: timestamp("sent_at", { withTimezone: true }),
  },
  (t) => [index("delivery_project_idx").on(t.projectId, t.createdAt), index("delivery_org_idx").on(t.organizationId, t.createdAt)],
);
