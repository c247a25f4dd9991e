/**
 * Requests of the glazing library: saved make-ups (layers as POST /api/v1/calc/glazing takes them) and
 * saved panes (one pane layer). Every change makes a new revision; PATCH names the revision it was
 * based on and a stale one is answered 409.
 */
import { z } from "./zod";
import { name, optionalText } from "./common";
import { GlazingRequest, LayerShape, MeasuredPane, Pane, PhysicalPane } from "./glazing";
import { MakeupValues } from "./results";
import { UploadInfo } from "./uploads";
import { docShape, id, instant, nextCursor } from "./wire";

/** Layers, outdoors first, validated exactly as the glazing calculation validates them. */
const Layers = docShape(
  z.array(z.unknown()),
  z.array(LayerShape).describe("Outdoors first: pane, gap, pane, … as POST /calc/glazing takes them"),
).transform((layers, ctx) => {
  const parsed = GlazingRequest.safeParse({ layers, anglesDeg: [0] });
  if (!parsed.success) {
    for (const issue of parsed.error.issues) ctx.addIssue({ ...issue } as never);
    return z.NEVER;
  }
  return parsed.data.layers;
});

const note = optionalText("note", 2000, { multiline: true });
const revision = z.number({ error: "revision must be a number" }).int("revision must be a whole number").positive("revision must be 1 or more");

export const MakeupCreateRequest = z.object({ name: name("name", 120), layers: Layers, note: note.optional() });
export type MakeupCreateRequest = z.output<typeof MakeupCreateRequest>;

export const MakeupPatchRequest = z
  .object({ revision, name: name("name", 120).optional(), layers: Layers.optional(), note })
  .refine((v) => v.name !== undefined || v.layers !== undefined || v.note !== undefined, {
    message: "nothing to change: send a name, layers or a note",
  });
export type MakeupPatchRequest = z.output<typeof MakeupPatchRequest>;

const PaneLayer = docShape(
  z.unknown(),
  z.union([PhysicalPane.partial({ kind: true }), MeasuredPane.partial({ kind: true })]).describe("The pane; `kind` may be left out"),
).transform((raw, ctx) => {
  const parsed = Pane.safeParse(typeof raw === "object" && raw !== null ? { kind: "pane", ...raw } : raw);
  if (!parsed.success) {
    for (const issue of parsed.error.issues) ctx.addIssue({ ...issue } as never);
    return z.NEVER;
  }
  return parsed.data;
});

export const PaneCreateRequest = z.object({ name: name("name", 120), layer: PaneLayer, note: note.optional() });
export type PaneCreateRequest = z.output<typeof PaneCreateRequest>;

export const PanePatchRequest = z
  .object({ revision, name: name("name", 120).optional(), layer: PaneLayer.optional(), note })
  .refine((v) => v.name !== undefined || v.layer !== undefined || v.note !== undefined, {
    message: "nothing to change: send a name, the pane or a note",
  });
export type PanePatchRequest = z.output<typeof PanePatchRequest>;

// ---- responses ------------------------------------------------------------------------------------------------

/** A saved make-up as the API answers it (its current revision unless another is asked for). */
export const MakeupEntry = z.object({
  id,
  organizationId: id,
  revision: z.number().int(),
  latestRevision: z.number().int().describe("The current revision (differs from `revision` when an older one was asked for)"),
  name: z.string(),
  description: z.string().describe("Generated from the layers, e.g. 6 mm | 16 mm argon | 6 mm"),
  layers: docShape(z.array(z.unknown()), z.array(LayerShape).describe("The layers as POST /calc/glazing takes them")),
  note: z.string().nullable(),
  values: MakeupValues,
  createdBy: z.string().nullable(),
  createdAt: instant,
  updatedAt: instant,
});
export type MakeupEntry = z.output<typeof MakeupEntry>;

export const PaneEntry = z.object({
  id,
  organizationId: id,
  revision: z.number().int(),
  latestRevision: z.number().int(),
  name: z.string(),
  description: z.string(),
  layer: docShape(z.unknown(), z.union([PhysicalPane, MeasuredPane]).describe("The pane as a make-up's layer takes it")),
  note: z.string().nullable(),
  createdBy: z.string().nullable(),
  createdAt: instant,
  updatedAt: instant,
});
export type PaneEntry = z.output<typeof PaneEntry>;

/** One line of an item's revision history. */
export const LibraryRevisionLine = z.object({ revision: z.number().int(), name: z.string(), createdBy: z.string().nullable(), createdAt: instant });
export type LibraryRevisionLine = z.output<typeof LibraryRevisionLine>;

export const MakeupDetailResponse = MakeupEntry.extend({
  revisions: z.array(LibraryRevisionLine),
  usedBy: z.array(z.object({ optionName: z.string(), projectName: z.string(), facadeName: z.string() })).describe("The façade options that use it"),
});
export const MakeupPageResponse = z.object({ items: z.array(MakeupEntry).describe("One page, by name"), nextCursor });
export const PanePageResponse = z.object({ items: z.array(PaneEntry).describe("One page, by name"), nextCursor });
export const PaneImportResponse = z.object({
  panes: z.array(PaneEntry).describe("Every pane of the file, saved as revision 1"),
  upload: UploadInfo,
  sha256: z.string().describe("SHA-256 of the uploaded file"),
});

/** GET /makeups/:id?revision=N: an older revision (a whole number from 1); omitted = the current one. */
export const MakeupRevisionQuery = z.object({
  revision: z
    .string()
    .regex(/^\d{1,6}$/, "revision must be a whole number from 1")
    .optional(),
});
