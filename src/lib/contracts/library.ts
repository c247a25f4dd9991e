/**
 * Requests of the glazing library: saved make-ups (layers as POST /api/v1/calc/glazing takes them) and
 * saved panes (one pane layer). Every change makes a new revision; PATCH names the revision it was
 * based on and a stale one is answered 409.
 */
import { z } from "./zod";
import { name, optionalText } from "./common";
import { GlazingRequest, Pane } from "./glazing";
import type { MakeupValues } from "./results";

/** Layers, outdoors first, validated exactly as the glazing calculation validates them. */
const Layers = z.array(z.unknown()).transform((layers, ctx) => {
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

const PaneLayer = z.unknown().transform((raw, ctx) => {
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

/** A saved make-up as the API answers it (its current revision unless another is asked for). */
export interface MakeupEntry {
  id: string;
  organizationId: string;
  revision: number;
  /** The current revision of the make-up (differs from `revision` when an older one was asked for). */
  latestRevision: number;
  name: string;
  description: string;
  layers: unknown[];
  note: string | null;
  values: MakeupValues;
  createdBy: string | null;
  createdAt: string;
  updatedAt: string;
}

export interface PaneEntry {
  id: string;
  organizationId: string;
  revision: number;
  latestRevision: number;
  name: string;
  description: string;
  layer: unknown;
  note: string | null;
  createdBy: string | null;
  createdAt: string;
  updatedAt: string;
}

/** One line of an item's revision history. */
export interface LibraryRevisionLine {
  revision: number;
  name: string;
  createdBy: string | null;
  createdAt: string;
}
