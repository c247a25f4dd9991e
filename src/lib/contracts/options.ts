/** Requests and answers of a façade's options: candidate make-ups from the library, named by the consultant. */
import { z } from "./zod";
import { name, rowId } from "./common";
import type { MakeupValues } from "./results";

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

export interface OptionEntry {
  id: string;
  projectId: string;
  facadeId: string;
  name: string;
  position: number;
  status: OptionStatus;
  version: number;
  makeupId: string;
  makeupName: string;
  /** The revision the option points at. */
  makeupRevision: number;
  /** The library's newest revision of the make-up; greater than makeupRevision when the library changed since. */
  latestMakeupRevision: number;
  description: string;
  layers: unknown[];
  values: MakeupValues;
  createdAt: string;
  updatedAt: string;
}
