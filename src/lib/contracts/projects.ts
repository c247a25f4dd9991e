import { z } from "./zod";
import { name, optionalText, rowId, timeZone } from "./common";
import { finite } from "./numbers";

export const FacadeInput = z.object({
  id: rowId.optional(),
  name: name("name", 120),
  azimuthDeg: finite("azimuthDeg", 0, 360).transform((v) => (v === 360 ? 0 : v)),
  tiltDeg: finite("tiltDeg", 0, 180).default(90),
});

const projectFields = {
  name: name("name", 200),
  reference: optionalText("reference", 60),
  buildingName: optionalText("buildingName", 200),
  siteName: name("siteName", 200),
  latitudeDeg: finite("latitudeDeg", -90, 90),
  longitudeDeg: finite("longitudeDeg", -180, 180),
  timeZone,
  elevationM: finite("elevationM", -500, 9000),
  description: optionalText("description", 5000, { multiline: true }),
  facades: z.array(FacadeInput).max(48, "a project has at most 48 façades"),
};

export const ProjectCreateRequest = z.object({
  organizationId: rowId,
  ...projectFields,
  elevationM: projectFields.elevationM.default(0),
  facades: projectFields.facades.default([]),
});
export type ProjectCreateRequest = z.infer<typeof ProjectCreateRequest>;

/** Partial update; when `facades` is given it is the full new list (ids keep existing rows). */
export const ProjectUpdateRequest = z
  .object(projectFields)
  .partial()
  .refine((v) => Object.keys(v).length > 0, { message: "nothing to update: send at least one field" });
export type ProjectUpdateRequest = z.infer<typeof ProjectUpdateRequest>;

export const ShareRequest = z.object({ memberId: rowId });

/** A member who sees only shared projects, and whether they see this one (the shares endpoints' rows). */
export interface ShareEntry {
  memberId: string;
  name: string;
  email: string;
  role: string;
  shared: boolean;
}
