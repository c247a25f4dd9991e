/**
 * Request and response of POST /api/v1/calc/schedule: hour-by-hour sun, irradiance and transmitted
 * solar energy for each surface (façade orientation + glazing make-up) of a site.
 */
import { z } from "./zod";
import { name, plainString, timeZone } from "./common";
import { GlazingRequest, LayerShape } from "./glazing";
import { docShape } from "./wire";
import { finite, positive } from "./numbers";

/** Surfaces × rows one request may ask for (a full year of hours for 6 surfaces; about 13 MB of JSON). */
export const MAX_SCHEDULE_ROWS = 6 * 8784;
export const MAX_SURFACES = 24;
export const MAX_SPAN_DAYS = 366;

const localDate = (label: string) =>
  z
    .string({ error: `${label} must be a date YYYY-MM-DD` })
    .regex(/^\d{4}-\d{2}-\d{2}$/, `${label} must be a date YYYY-MM-DD`)
    .refine((s) => {
      const d = new Date(`${s}T00:00:00Z`);
      return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 10) === s;
    }, `${label} is not a real calendar date`);

export const Site = z.object({
  latitudeDeg: finite("latitudeDeg", -90, 90),
  longitudeDeg: finite("longitudeDeg", -180, 180),
  timeZone,
  elevationM: finite("elevationM", -500, 9000).optional().default(0),
});

/** The words a shading device's messages use for each of its fields. */
export interface ShadingLabels {
  overhangDepth: string;
  overhangGapAbove: string;
  overhangExtensionLeft: string;
  overhangExtensionRight: string;
  finDepth: string;
  finGap: string;
  horizon: string;
}

/**
 * The shading devices around a window (overhang, side fins, horizon), their ranges in one place; the
 * labels only change how the messages name the fields.
 */
export const shadingDevices = (l: ShadingLabels) => ({
  overhang: z
    .object({
      depthM: finite(l.overhangDepth, 0, 50),
      gapAboveM: finite(l.overhangGapAbove, 0, 50),
      /** How far the overhang runs past each side of the window; omitted = very long. */
      extensionLeftM: finite(l.overhangExtensionLeft, 0, 100).optional(),
      extensionRightM: finite(l.overhangExtensionRight, 0, 100).optional(),
    })
    .optional(),
  fins: z.object({ depthM: finite(l.finDepth, 0, 50), gapM: finite(l.finGap, 0, 50) }).optional(),
  /** Obstructions on the horizon in front of the window (buildings, terrain), degrees above horizontal. */
  horizonDeg: finite(l.horizon, 0, 89).optional(),
});

export const Shading = z.object({
  window: z.object({ widthM: positive("widthM", 100), heightM: positive("heightM", 100) }),
  ...shadingDevices({
    overhangDepth: "depthM",
    overhangGapAbove: "gapAboveM",
    overhangExtensionLeft: "extensionLeftM",
    overhangExtensionRight: "extensionRightM",
    finDepth: "depthM",
    finGap: "gapM",
    horizon: "horizonDeg",
  }),
});

const MONTHS = 12;

export const Sky = z
  .object({
    /** Sky-diffuse model for tilted surfaces. */
    model: z.enum(["perez", "hay-davies", "isotropic"]).optional().default("perez"),
    /** Linke turbidity, one value or twelve monthly values (January first). */
    linkeTurbidity: z
      .union([finite("linkeTurbidity", 1, 10), z.array(finite("linkeTurbidity", 1, 10)).length(MONTHS, "linkeTurbidity needs 12 monthly values")])
      .optional(),
    /** Ground reflectance (albedo). */
    albedo: finite("albedo", 0, 1).optional().default(0.2),
  })
  .optional()
  .transform((s) => s ?? { model: "perez" as const, albedo: 0.2, linkeTurbidity: undefined });

export const WeatherRow = z.object({
  /** ISO-8601 instant with offset or Z: the midpoint of the hour the values stand for. */
  time: plainString("time").refine(
    (t) => /[zZ]|[+-]\d{2}:?\d{2}$/.test(t) && !Number.isNaN(Date.parse(t)),
    "time must be an ISO-8601 instant with a UTC offset",
  ),
  ghi: finite("ghi", 0, 1500),
  dni: finite("dni", 0, 1500),
  dhi: finite("dhi", 0, 1000),
});

export const ScheduleSurface = z.object({
  name: name("name", 120),
  azimuthDeg: finite("azimuthDeg", 0, 360).transform((v) => (v === 360 ? 0 : v)),
  tiltDeg: finite("tiltDeg", 0, 180),
  layers: docShape(z.array(z.unknown()), z.array(LayerShape).describe("The make-up, outdoors first, as POST /calc/glazing takes it")),
  shading: Shading.optional(),
  /** Glazed area for the W and kWh columns; default the shading window's area, else none. */
  glazedAreaM2: positive("glazedAreaM2", 10_000).optional(),
});

export const ScheduleRequest = z
  .object({
    site: Site,
    surfaces: docShape(
      z.array(z.unknown()).min(1, "surfaces must contain at least one surface").max(MAX_SURFACES, `at most ${MAX_SURFACES} surfaces`),
      z.array(ScheduleSurface),
    ),
    from: localDate("from"),
    to: localDate("to"),
    stepMinutes: z
      .number({ error: "stepMinutes must be a number" })
      .int("stepMinutes must be a whole number")
      .refine((v) => v >= 1 && v <= 1440 && 1440 % v === 0, "stepMinutes must divide a day evenly (e.g. 10, 15, 30, 60)")
      .optional()
      .default(60),
    sky: Sky,
    /** Measured or typical-year weather in place of the clear sky. */
    weather: z
      .array(WeatherRow)
      .max(MAX_SPAN_DAYS * 24 + 48, "weather may hold at most one year of hours")
      .optional(),
  })
  .superRefine((r, ctx) => {
    if (r.from > r.to) ctx.addIssue({ code: "custom", path: ["to"], message: "to must not be before from" });
    const days = (Date.parse(`${r.to}T00:00:00Z`) - Date.parse(`${r.from}T00:00:00Z`)) / 86_400_000 + 1;
    if (days > MAX_SPAN_DAYS) ctx.addIssue({ code: "custom", path: ["to"], message: `at most ${MAX_SPAN_DAYS} days per request` });
  })
  .transform((r, ctx) => {
    const surfaces: (z.output<typeof ScheduleSurface> & { glazing: z.output<typeof GlazingRequest> })[] = [];
    r.surfaces.forEach((raw, i) => {
      const s = ScheduleSurface.safeParse(raw);
      if (!s.success) {
        for (const issue of s.error.issues) ctx.addIssue({ ...issue, path: ["surfaces", i, ...issue.path] } as never);
        return;
      }
      const g = GlazingRequest.safeParse({ layers: s.data.layers, tiltDeg: Math.min(90, s.data.tiltDeg) });
      if (!g.success) {
        for (const issue of g.error.issues) ctx.addIssue({ ...issue, path: ["surfaces", i, ...issue.path] } as never);
        return;
      }
      surfaces.push({ ...s.data, glazing: g.data });
    });
    return { ...r, surfaces };
  });
export type ScheduleRequest = z.output<typeof ScheduleRequest>;
export type ScheduleRequestInput = z.input<typeof ScheduleRequest>;

// ---- responses ------------------------------------------------------------------------------------------------

export const ScheduleRow = z.object({
  time: z.string().describe("Local time with offset: the midpoint of the step the values stand for"),
  sunAltitudeDeg: z.number(),
  sunAzimuthDeg: z.number(),
  incidenceDeg: z.number().describe("Angle between the sun and the surface's normal"),
  beamTransmittance: z.number(),
  sunlitFraction: z.number().describe("Share of the window in sun (shading devices, horizon)"),
  beamIncidentWm2: z.number(),
  diffuseIncidentWm2: z.number(),
  transmittedWm2: z.number(),
  solarGainWm2: z.number(),
  transmittedW: z.number().nullable().optional().describe("With a glazed area"),
  solarGainW: z.number().nullable().optional().describe("With a glazed area"),
});
export type ScheduleRow = z.output<typeof ScheduleRow>;

export const PeriodTotals = z.object({
  incidentKWhPerM2: z.number(),
  transmittedKWhPerM2: z.number(),
  solarGainKWhPerM2: z.number(),
  transmittedKWh: z.number().nullable(),
  solarGainKWh: z.number().nullable(),
  peak: z.object({ time: z.string(), transmittedWm2: z.number(), solarGainWm2: z.number() }).nullable(),
});
export type PeriodTotals = z.output<typeof PeriodTotals>;

/** Daily, monthly and whole-period totals of one surface. */
export const ScheduleSurfaceTotals = z.object({
  daily: z.array(PeriodTotals.extend({ date: z.string() })),
  monthly: z.array(PeriodTotals.extend({ month: z.string() })),
  period: PeriodTotals.extend({ from: z.string(), to: z.string() }),
});
export type ScheduleSurfaceTotals = z.output<typeof ScheduleSurfaceTotals>;

/** One surface of a schedule response: its glazing's summary values, its rows and totals. */
export const ScheduleSurfaceResult = z.object({
  name: z.string(),
  azimuthDeg: z.number(),
  tiltDeg: z.number(),
  glazedAreaM2: z.number().nullable(),
  normalTransmittance: z.number(),
  diffuseTransmittance: z.number(),
  normalGValue: z.number(),
  diffuseGValue: z.number(),
  uValue: z.number().describe("Centre-of-glass U-value, W/(m²K)"),
  rows: z.array(ScheduleRow),
  totals: ScheduleSurfaceTotals,
});
export type ScheduleSurfaceResult = z.output<typeof ScheduleSurfaceResult>;

/** Body of a successful POST /api/v1/calc/schedule. */
export const ScheduleResponse = z.object({
  site: z.object({ latitudeDeg: z.number(), longitudeDeg: z.number(), timeZone: z.string(), elevationM: z.number() }),
  from: z.string(),
  to: z.string(),
  stepMinutes: z.number().int(),
  timeZone: z.string(),
  rowsPerSurface: z.number().int(),
  irradiance: z.enum(["weather series", "clear sky"]),
  sky: z.object({ model: z.enum(["perez", "hay-davies", "isotropic"]), albedo: z.number() }),
  methods: z.record(z.string(), z.string()).describe("The models used, in words, one entry per step of the computation"),
  surfaces: z.array(ScheduleSurfaceResult),
  warnings: z.array(z.string()),
});
export type ScheduleResponse = z.output<typeof ScheduleResponse>;
