/** Requests and answers of a façade's options: candidate make-ups from the library, named by the consultant. */
import { z } from "./zod";
import { name, rowId } from "./common";
import { MakeupValues } from "./results";
import { LayerShape } from "./glazing";
import { docShape, id, instant } from "./wire";

export const OptionCreateRequest = z.object({ facadeId: rowId, makeupId: rowId, name: name("Option name", 120) });
export type OptionCreateRequest = z.infer<typeof OptionCreateRequest>;

const version = z.number({ error: "version must be a number" }).int("version must be a whole number").positive("version must be 1 or more");

export const OptionPatchRequest = z
  .object({
    /** The version read; a stale one answers 409. */
    version,
    name: name("Option name", 120).optional(),
    /** Another make-up of the library (its current revision). */
    makeupId: rowId.optional(),
    /** Re-point at the make-up's newest revision. */
    makeupRevision: z.literal("latest", { error: 'makeupRevision must be "latest"' }).optional(),
    position: z.number({ error: "position must be a number" }).int("position must be a whole number").min(0).max(100).optional(),
  })
  .refine((v) => v.name !== undefined || v.makeupId !== undefined || v.makeupRevision !== undefined || v.position !== undefined, {
    message: "nothing to change: send a name, a make-up or a position",
  });
export type OptionPatchRequest = z.infer<typeof OptionPatchRequest>;

export type OptionStatus = "proposed" | "approved" | "rejected";

// ---- responses ------------------------------------------------------------------------------------------------

export const OptionEntry = z.object({
  id,
  projectId: id,
  facadeId: id,
  name: z.string(),
  position: z.number().int(),
  status: z.enum(["proposed", "approved", "rejected"]),
  version: z.number().int().describe("Send it back with PATCH (409 when someone changed the option meanwhile)"),
  makeupId: id,
  makeupName: z.string(),
  makeupRevision: z.number().int().describe("The make-up revision the option points at"),
  latestMakeupRevision: z.number().int().describe("The library's newest revision; greater than makeupRevision when the library changed since"),
  description: z.string(),
  layers: docShape(z.array(z.unknown()), z.array(LayerShape).describe("The make-up's layers, outdoors first")),
  values: MakeupValues,
  createdAt: instant,
  updatedAt: instant,
});
export type OptionEntry = z.output<typeof OptionEntry>;

export const OptionListResponse = z.object({ options: z.array(OptionEntry) });
export const OptionCreatedResponse = z.object({ option: OptionEntry });
export const OptionUpdatedResponse = z.object({
  option: OptionEntry,
  approvalWithdrawn: z.boolean().describe("True when the change sent an approved option back to proposed"),
});
