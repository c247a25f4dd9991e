import { z } from "./zod";
import { name, optionalText, rowId, timeZone } from "./common";
import { finite, positive } from "./numbers";
import { shadingDevices } from "./schedule";
import { ROLE_NAMES } from "@/lib/auth/roles";
import { docShape, id, instant, nextCursor } from "./wire";
import { InstantPageQuery } from "./pagination";

/** An empty number field (a form's NaN, "" or null) is "not given". */
const optionalNumber = <T extends z.ZodType>(schema: T) =>
  z.preprocess((v) => (v === "" || v === null || (typeof v === "number" && Number.isNaN(v)) ? null : v), schema.nullable()).optional();

/**
 * Shading devices of a façade as the schedule engine takes them (its Shading without the window: the
 * façade's typical window is the window), with messages that name the fields in words.
 */
export const FacadeShading = z.object(
  shadingDevices({
    overhangDepth: "Overhang depth (m)",
    overhangGapAbove: "Overhang gap above the window (m)",
    overhangExtensionLeft: "Overhang run past the left side (m)",
    overhangExtensionRight: "Overhang run past the right side (m)",
    finDepth: "Fin depth (m)",
    finGap: "Fin gap from the window edge (m)",
    horizon: "Horizon angle (°)",
  }),
);
export type FacadeShading = z.infer<typeof FacadeShading>;

export const SKY_MODELS = ["perez", "hay-davies", "isotropic"] as const;
export const SKY_MODEL_LABELS: Record<(typeof SKY_MODELS)[number], string> = {
  perez: "Perez 1990 (anisotropic)",
  "hay-davies": "Hay–Davies 1980",
  isotropic: "Isotropic (Liu–Jordan 1960)",
};

export const FacadeInput = z
  .object({
    id: rowId.optional(),
    name: name("name", 120),
    azimuthDeg: finite("azimuthDeg", 0, 360).transform((v) => (v === 360 ? 0 : v)),
    tiltDeg: finite("tiltDeg", 0, 180).default(90),
    /** Glazed area of the whole façade for W and kWh totals; empty = per m² only. */
    glazedAreaM2: optionalNumber(positive("Glazed area (m²)", 100_000)),
    /** The typical window the shading devices are drawn around. */
    windowWidthM: optionalNumber(positive("Window width (m)", 100)),
    windowHeightM: optionalNumber(positive("Window height (m)", 100)),
    shading: FacadeShading.nullish(),
  })
  .superRefine((f, ctx) => {
    if ((f.windowWidthM == null) !== (f.windowHeightM == null))
      ctx.addIssue({
        code: "custom",
        path: [f.windowWidthM == null ? "windowWidthM" : "windowHeightM"],
        message: "give the window's width and height, or neither",
      });
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
  /** Ground reflectance in front of the façades (0.2 when not given). */
  groundAlbedo: finite("Ground albedo", 0, 1).optional(),
  skyModel: z.enum(SKY_MODELS, { error: 'Sky model must be "perez", "hay-davies" or "isotropic"' }).optional(),
  /** Twelve monthly Linke turbidity values, January first; null = the engine's monthly defaults. */
  linkeTurbidity: z
    .array(finite("Linke turbidity", 1, 10))
    .length(12, "Linke turbidity needs twelve monthly values, January first")
    .nullable()
    .optional(),
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

// ---- responses ------------------------------------------------------------------------------------------------

/** A project as stored. */
export const ProjectView = z.object({
  id,
  organizationId: id,
  name: z.string(),
  reference: z.string().nullable().describe("The firm's own job number"),
  buildingName: z.string().nullable(),
  siteName: z.string(),
  latitudeDeg: z.number(),
  longitudeDeg: z.number(),
  timeZone: z.string().describe("IANA time zone of the site"),
  elevationM: z.number(),
  groundAlbedo: z.number(),
  skyModel: z.enum(SKY_MODELS),
  linkeTurbidity: z.array(z.number()).nullable().describe("Twelve monthly values, January first; null = the engine's default"),
  description: z.string().nullable(),
  createdById: z.string().nullable(),
  createdAt: instant,
  updatedAt: instant,
});

/** A façade as stored. */
export const FacadeView = z.object({
  id,
  projectId: id,
  name: z.string(),
  azimuthDeg: z.number().describe("Outward normal, degrees clockwise from north"),
  tiltDeg: z.number().describe("From horizontal: 90 = vertical wall"),
  glazedAreaM2: z.number().nullable(),
  windowWidthM: z.number().nullable(),
  windowHeightM: z.number().nullable(),
  shading: docShape(
    z
      .looseObject({ overhang: z.unknown().optional(), fins: z.unknown().optional(), horizonDeg: z.number().optional() })
      .nullable()
      .describe("Shading devices around the typical window; null = none"),
    FacadeShading.nullable().describe("Shading devices around the typical window; null = none"),
  ),
  position: z.number().int(),
  createdAt: instant,
  updatedAt: instant,
});

export const ProjectListResponse = z.object({
  nextCursor,
  organizations: z.array(
    z.object({
      organizationId: id,
      organizationName: z.string(),
      role: z.enum(ROLE_NAMES),
      projects: z.array(ProjectView.extend({ facadeCount: z.number().int() })).describe("Most recently changed first"),
    }),
  ),
});
export const ProjectCreatedResponse = z.object({ project: ProjectView });
export const ProjectResponse = z.object({
  project: ProjectView,
  facades: z.array(FacadeView),
  role: z.enum(ROLE_NAMES).describe("The caller's role"),
});
export const ProjectUpdatedResponse = z.object({ project: ProjectView, facades: z.array(FacadeView) });

/** A member who sees only shared projects, and whether they see this one (the shares endpoints' rows). */
export const ShareEntry = z.object({ memberId: id, name: z.string(), email: z.string(), role: z.string(), shared: z.boolean() });
export type ShareEntry = z.output<typeof ShareEntry>;
export const SharesPageResponse = z.object({ shares: z.array(ShareEntry), nextCursor });
export const ShareListResponse = z.object({ shares: z.array(ShareEntry) });

/** GET /projects: a page, optionally of one organisation. */
export const ProjectListQuery = InstantPageQuery.extend({ organizationId: rowId.optional() });
