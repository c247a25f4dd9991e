/**
 * Request and response of POST /api/v1/calc/glazing. The same schema validates the make-up form.
 * Layers are listed from outdoors inwards and alternate pane, gap, pane, …; 1 to 6 panes.
 */
import { z } from "./zod";
import { bounded, fraction } from "./numbers";
import { docShape } from "./wire";

export const MAX_PANES = 6;

/** Corrected (hemispherical) emissivity of a glass surface; uncoated soda-lime glass is 0.837 (EN 673). */
const emissivity = (label: string) => bounded(label, 0.01, 1).optional();

export const DEFAULT_EMISSIVITY = 0.837;

export const MeasuredValues = z
  .object({
    solarTransmittance: fraction("solarTransmittance"),
    solarReflectanceFront: fraction("solarReflectanceFront"),
    solarReflectanceBack: fraction("solarReflectanceBack"),
    visibleTransmittance: fraction("visibleTransmittance").optional(),
    visibleReflectanceFront: fraction("visibleReflectanceFront").optional(),
    visibleReflectanceBack: fraction("visibleReflectanceBack").optional(),
  })
  .superRefine((m, ctx) => {
    const sum = (t: number, r: number) => t + r > 1 + 1e-9;
    if (sum(m.solarTransmittance, m.solarReflectanceFront))
      ctx.addIssue({ code: "custom", path: ["solarReflectanceFront"], message: "solarTransmittance + solarReflectanceFront must not exceed 1" });
    if (sum(m.solarTransmittance, m.solarReflectanceBack))
      ctx.addIssue({ code: "custom", path: ["solarReflectanceBack"], message: "solarTransmittance + solarReflectanceBack must not exceed 1" });
    if (m.solarTransmittance <= 0)
      ctx.addIssue({ code: "custom", path: ["solarTransmittance"], message: "solarTransmittance must be greater than 0" });
    // Light values: all three, none, or the transmittance alone (many data sheets give no light reflectance).
    const reflectances = [m.visibleReflectanceFront, m.visibleReflectanceBack].filter((v) => v !== undefined).length;
    if (reflectances === 1)
      ctx.addIssue({
        code: "custom",
        path: [m.visibleReflectanceFront === undefined ? "visibleReflectanceFront" : "visibleReflectanceBack"],
        message: "give the light reflectance of both faces, or neither",
      });
    if (reflectances > 0 && m.visibleTransmittance === undefined)
      ctx.addIssue({ code: "custom", path: ["visibleTransmittance"], message: "visibleTransmittance is needed with the light reflectances" });
    if (m.visibleTransmittance !== undefined && reflectances === 0 && m.visibleTransmittance <= 0)
      ctx.addIssue({ code: "custom", path: ["visibleTransmittance"], message: "visibleTransmittance must be greater than 0" });
    const given = m.visibleTransmittance !== undefined ? 1 + reflectances : 0;
    if (given === 3) {
      if (m.visibleTransmittance! <= 0)
        ctx.addIssue({ code: "custom", path: ["visibleTransmittance"], message: "visibleTransmittance must be greater than 0" });
      if (sum(m.visibleTransmittance!, m.visibleReflectanceFront!))
        ctx.addIssue({
          code: "custom",
          path: ["visibleReflectanceFront"],
          message: "visibleTransmittance + visibleReflectanceFront must not exceed 1",
        });
      if (sum(m.visibleTransmittance!, m.visibleReflectanceBack!))
        ctx.addIssue({
          code: "custom",
          path: ["visibleReflectanceBack"],
          message: "visibleTransmittance + visibleReflectanceBack must not exceed 1",
        });
    }
  });
export type MeasuredValues = z.infer<typeof MeasuredValues>;

const paneCommon = {
  kind: z.literal("pane"),
  thicknessMm: bounded("thicknessMm", 0.5, 60),
  emissivityFront: emissivity("emissivityFront"),
  emissivityBack: emissivity("emissivityBack"),
};

export const PhysicalPane = z.object({
  ...paneCommon,
  refractiveIndex: bounded("refractiveIndex", 1, 4, { minExclusive: true }),
  absorptionPerMm: bounded("absorptionPerMm", 0, 20),
});

export const MeasuredPane = z.object({ ...paneCommon, measured: MeasuredValues });

/**
 * A pane is physical (refractiveIndex + absorptionPerMm) or measured (`measured` values); the
 * presence of `measured` decides which, so that errors name the missing field. Unknown extra keys
 * (e.g. a name) are ignored.
 */
export const Pane = z.unknown().transform((raw, ctx): z.infer<typeof PhysicalPane> | z.infer<typeof MeasuredPane> => {
  const isMeasured = typeof raw === "object" && raw !== null && "measured" in raw;
  if (isMeasured && ("refractiveIndex" in raw || "absorptionPerMm" in raw)) {
    ctx.addIssue({ code: "custom", path: ["measured"], message: "give either measured values or refractiveIndex and absorptionPerMm, not both" });
    return z.NEVER;
  }
  const parsed = (isMeasured ? MeasuredPane : PhysicalPane).safeParse(raw);
  if (!parsed.success) {
    for (const issue of parsed.error.issues) ctx.addIssue(issue as never);
    return z.NEVER;
  }
  return parsed.data;
});
export type Pane = z.output<typeof Pane>;

export const GAS_NAMES = ["air", "argon", "krypton"] as const;
export type GasName = (typeof GAS_NAMES)[number];

export const GasMix = z
  .object({ air: fraction("air").optional(), argon: fraction("argon").optional(), krypton: fraction("krypton").optional() })
  .strict()
  .refine((g) => Math.abs((g.air ?? 0) + (g.argon ?? 0) + (g.krypton ?? 0) - 1) <= 1e-3, "the gas fractions must add up to 1");

export const Gas = z.union([z.enum(GAS_NAMES), GasMix], {
  error: `gas must be "air", "argon", "krypton" or fractions such as { "argon": 0.9, "air": 0.1 }`,
});
export type Gas = z.infer<typeof Gas>;

export const Gap = z.object({
  kind: z.literal("gap"),
  widthMm: bounded("widthMm", 1, 100),
  gas: Gas,
});
export type Gap = z.infer<typeof Gap>;

const DEFAULT_ANGLES = Array.from({ length: 10 }, (_, i) => i * 10);

/** A layer as the API document shows it: a pane (glass properties or measured values) or a gas gap. */
export const LayerShape = z.union([PhysicalPane, MeasuredPane, Gap]);

export const GlazingRequest = z
  .object({
    layers: docShape(
      z
        .array(z.unknown())
        .min(1, "layers must contain at least one pane")
        .max(2 * MAX_PANES - 1, `at most ${MAX_PANES} panes (${2 * MAX_PANES - 1} layers)`),
      z.array(LayerShape).describe("Outdoors first: pane, gap, pane, … starting and ending with a pane"),
    ),
    anglesDeg: z
      .array(bounded("anglesDeg", 0, 90))
      .min(1, "anglesDeg must not be empty")
      .max(181, "at most 181 angles")
      .optional()
      .transform((a) => a ?? DEFAULT_ANGLES),
    /** "per-polarization" (default): the stack is solved for s and p separately, then averaged. */
    polarization: z.enum(["per-polarization", "averaged"]).optional().default("per-polarization"),
    /** Tilt of the glazing from horizontal for the gap convection of EN 673 (90 = vertical, the declared condition). */
    tiltDeg: bounded("tiltDeg", 0, 90).optional().default(90),
  })
  .transform((req, ctx) => {
    const layers: (Pane | Gap)[] = [];
    req.layers.forEach((raw, i) => {
      const expect = i % 2 === 0 ? "pane" : "gap";
      const kind = typeof raw === "object" && raw && "kind" in raw ? (raw as { kind: unknown }).kind : undefined;
      if (kind !== expect) {
        ctx.addIssue({
          code: "custom",
          path: ["layers", i, "kind"],
          message:
            i === 0
              ? "the first layer (outdoors) must be a pane"
              : `layer ${i} must be a ${expect}: layers alternate pane, gap, pane, … and start and end with a pane`,
        });
        return;
      }
      const parsed = (expect === "pane" ? Pane : Gap).safeParse(raw);
      if (!parsed.success) {
        for (const issue of parsed.error.issues) ctx.addIssue({ ...issue, path: ["layers", i, ...issue.path] } as never);
        return;
      }
      layers.push(parsed.data);
    });
    if (req.layers.length % 2 === 0) {
      ctx.addIssue({ code: "custom", path: ["layers", req.layers.length - 1], message: "the last layer (indoors) must be a pane" });
    }
    return { ...req, layers };
  });
export type GlazingRequest = z.output<typeof GlazingRequest>;
export type GlazingRequestInput = z.input<typeof GlazingRequest>;

// ---- responses ------------------------------------------------------------------------------------------------

const share = z.number().describe("0–1");
const lightValue = z.number().nullable().describe("0–1; null unless every pane has measured visible values");

/** The values of a make-up at one angle or averaged over the hemisphere. */
export const GlazingValues = z.object({
  solarTransmittance: share,
  solarReflectanceFront: share,
  solarReflectanceBack: share,
  layerAbsorptance: z.array(z.number()).describe("One per pane, outdoor first, of solar radiation incident from outdoors"),
  gValue: z.number().describe("Total solar energy transmittance (EN 410), 0–1"),
  visibleTransmittance: lightValue,
  visibleReflectanceFront: lightValue,
  visibleReflectanceBack: lightValue,
});
export type GlazingValues = z.output<typeof GlazingValues>;

export const GlazingAngleRow = GlazingValues.extend({ angleDeg: z.number().describe("Angle of incidence, degrees") });
export type GlazingAngleRow = z.output<typeof GlazingAngleRow>;

/**
 * The make-up's light transmittance at normal incidence. "measured": every pane has its three light values
 * (then the angular values carry τv too); "transmittance only": some pane gives τv alone, so its light
 * reflectance is unknown and τv is exact only when no unknown reflectance enters it (a single pane), a
 * range otherwise; "not given": some pane has no light values.
 */
export const LightSummary = z.object({
  basis: z.enum(["measured", "transmittance only", "not given"]),
  transmittance: z.number().nullable(),
  range: z.object({ low: z.number(), high: z.number() }).nullable(),
  reflectanceFront: z.number().nullable(),
  reflectanceBack: z.number().nullable(),
});
export type LightSummary = z.output<typeof LightSummary>;

/** Body of a successful POST /api/v1/calc/glazing (further members may be added in later versions). */
export const GlazingResponse = z.looseObject({
  angles: z.array(GlazingAngleRow).describe("One row per requested angle"),
  hemispherical: GlazingValues,
  uValue: z.number().describe("Centre-of-glass U-value (EN 673), W/(m²K), unrounded"),
  warnings: z.array(z.string()),
  light: LightSummary,
});
export type GlazingResponse = z.output<typeof GlazingResponse>;
