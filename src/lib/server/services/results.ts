/**
 * The project results: every façade × option for a year, from the option's stored make-up revision, the
 * façade and the site, through the schedule engine (the calc worker pool, up to 24 surfaces a task).
 *
 * Each façade × option result is cached in result_cache under the SHA-256 of everything that enters it
 * (make-up layers, façade orientation and shading, site and sky, year, engine version): a change touches
 * only the entries it enters, stale keys simply miss, and the project's rows no longer reachable are pruned.
 * Flags are worked out on every call from the cached figures and the current requirements (cheap).
 */
import { createHash } from "node:crypto";
import { and, asc, eq, inArray, lt, notInArray, or, sql } from "drizzle-orm";
import { db } from "@/lib/server/db/client";
import { facade, facadeOption, makeup, makeupRevision, project, resultCache } from "@/lib/server/db/schema";
import { NotFoundError } from "@/lib/server/errors";
import { runCalc, sharedCalcPool, type CalcPool } from "@/lib/server/calc-pool";
import { requirementsEntry } from "./requirements";
import { weatherForResults, type ResultsWeather } from "./uploads";
import { MAX_SURFACES, ScheduleRequest, type ScheduleRequestInput } from "@/lib/contracts/schedule";
import type {
  CompareOption,
  CompareResponse,
  FacadeResult,
  MakeupValues,
  OptionResult,
  ResultsResponse,
  RevisionSnapshot,
} from "@/lib/contracts/results";
import { GlazingRequest, type GlazingResponse } from "@/lib/contracts/glazing";
import { COMPARE_ANGLES_DEG } from "@/lib/contracts/revisions";
import type { SurfaceYearSummary } from "@/lib/calc/surface-year";
import { makeupLight } from "@/lib/calc/makeup-light";
import { effectiveLimits, requirementFlags } from "@/lib/calc/requirement-flags";

/** Changes whenever the engine's figures for the same inputs would change; old cache entries then miss. */
export const RESULTS_ENGINE_VERSION = "paneray-results-1";

/** Cache rows of a project older than this are pruned even when they belong to another year. */
const PRUNE_OTHER_YEARS_AFTER_DAYS = 30;

type ProjectRow = typeof project.$inferSelect;
type FacadeRow = typeof facade.$inferSelect;

/** A zod issue path as the API writes fields (surfaces[0].layers[2].widthMm). */
const pathText = (path: readonly PropertyKey[]) =>
  path
    .map((x) => (typeof x === "number" ? `[${x}]` : String(x)))
    .join(".")
    .replace(/\.\[/g, "[");

export const sha256 = (text: string) => createHash("sha256").update(text).digest("hex");

/** JSON with object keys sorted, so that equal inputs give equal text whatever the key order stored. */
export function stableJson(value: unknown): string {
  if (value === null || typeof value !== "object") return JSON.stringify(value ?? null);
  if (Array.isArray(value)) return `[${value.map(stableJson).join(",")}]`;
  const o = value as Record<string, unknown>;
  return `{${Object.keys(o)
    .filter((k) => o[k] !== undefined)
    .sort()
    .map((k) => `${JSON.stringify(k)}:${stableJson(o[k])}`)
    .join(",")}}`;
}

/** The site and sky as the engine takes them, from the project row. */
export function siteOf(p: ProjectRow): RevisionSnapshot["site"] {
  return {
    name: p.siteName,
    latitudeDeg: p.latitudeDeg,
    longitudeDeg: p.longitudeDeg,
    timeZone: p.timeZone,
    elevationM: p.elevationM,
    groundAlbedo: p.groundAlbedo,
    skyModel: p.skyModel,
    linkeTurbidity: p.linkeTurbidity ?? null,
  };
}

/** The façade's window and devices as the schedule engine's Shading, or undefined (no window, no devices). */
export function shadingOf(f: Pick<FacadeRow, "windowWidthM" | "windowHeightM" | "shading">): Record<string, unknown> | undefined {
  if (!f.windowWidthM || !f.windowHeightM) return undefined;
  const devices = (f.shading ?? {}) as Record<string, unknown>;
  return { ...devices, window: { widthM: f.windowWidthM, heightM: f.windowHeightM } };
}

/**
 * The schedule request of one year of hours for some surfaces of a project's site. With the project's
 * weather series (`weatherForResults`), the period is the file's (its first to last local date, whatever
 * `year` says) and the engine takes the file's irradiance in place of the clear sky.
 */
export function yearRequestInput(p: ProjectRow, year: number, surfaces: unknown[], weather?: ResultsWeather | null): ScheduleRequestInput {
  return {
    site: { latitudeDeg: p.latitudeDeg, longitudeDeg: p.longitudeDeg, timeZone: p.timeZone, elevationM: p.elevationM },
    surfaces,
    from: weather ? weather.irradiance.fromDate : `${year}-01-01`,
    to: weather ? weather.irradiance.toDate : `${year}-12-31`,
    stepMinutes: 60,
    sky: { model: p.skyModel, albedo: p.groundAlbedo, ...(p.linkeTurbidity ? { linkeTurbidity: p.linkeTurbidity } : {}) },
    ...(weather ? { weather: weather.rows } : {}),
  };
}

/** The year a result stands for: the requested one, or with a weather series the year its period starts in. */
export const resultYear = (year: number, weather?: ResultsWeather | null) => (weather ? Number(weather.irradiance.fromDate.slice(0, 4)) : year);

/** What one façade × option result is computed from; its SHA-256 is the cache key (a weather file by its SHA-256). */
export function resultInputs(p: ProjectRow, f: FacadeRow, layers: unknown, year: number, weather?: ResultsWeather | null) {
  return {
    engine: RESULTS_ENGINE_VERSION,
    year: resultYear(year, weather),
    site: { latitudeDeg: p.latitudeDeg, longitudeDeg: p.longitudeDeg, timeZone: p.timeZone, elevationM: p.elevationM },
    sky: { model: p.skyModel, albedo: p.groundAlbedo, linkeTurbidity: p.linkeTurbidity ?? null },
    surface: { azimuthDeg: f.azimuthDeg, tiltDeg: f.tiltDeg, shading: shadingOf(f) ?? null, layers },
    ...(weather ? { weather: { sha256: weather.irradiance.sha256, from: weather.irradiance.fromDate, to: weather.irradiance.toDate } } : {}),
  };
}

interface CachedSummary extends Omit<SurfaceYearSummary, "name"> {
  year: number;
}

interface Entry {
  facade: FacadeRow;
  option: typeof facadeOption.$inferSelect;
  makeupName: string;
  revision: typeof makeupRevision.$inferSelect;
  key: string;
  surface: Record<string, unknown>;
  problem?: string;
}

export interface ProjectResultsOptions {
  /** The worker pool to compute in; default the process's shared pool (null: on this thread). */
  pool?: CalcPool | null;
  /** Only these options (default all). */
  optionIds?: readonly string[];
}

/** Options of a project with their make-up revision and make-up name, in façade order. */
async function optionRows(projectId: string, optionIds?: readonly string[]) {
  return db
    .select({ option: facadeOption, revision: makeupRevision, makeupName: makeup.name })
    .from(facadeOption)
    .innerJoin(makeupRevision, eq(makeupRevision.id, facadeOption.makeupRevisionId))
    .innerJoin(makeup, eq(makeup.id, facadeOption.makeupId))
    .where(optionIds ? and(eq(facadeOption.projectId, projectId), inArray(facadeOption.id, [...optionIds])) : eq(facadeOption.projectId, projectId))
    .orderBy(asc(facadeOption.facadeId), asc(facadeOption.position), asc(facadeOption.createdAt), asc(facadeOption.id));
}

/** Runs one batch of ≤ 24 surfaces through the pool (or on this thread). */
async function computeBatch(pool: CalcPool | null, req: ScheduleRequest): Promise<SurfaceYearSummary[]> {
  return runCalc<"surfaceYear", SurfaceYearSummary[]>(pool, "surfaceYear", req);
}

const emptySummary = (year: number): CachedSummary => ({
  year,
  annual: { transmittedKWhm2: 0, solarGainKWhm2: 0 },
  peak: { transmittedWm2: 0, at: null },
  monthly: { transmittedKWhm2: Array(12).fill(0), solarGainKWhm2: Array(12).fill(0) },
});

/**
 * Results of every façade × option of a project for a calendar year (hourly clear-sky schedule in the
 * site's time zone). NotFoundError when the project does not exist (callers check access first).
 */
export async function projectResults(projectId: string, requestedYear: number, opts: ProjectResultsOptions = {}): Promise<ResultsResponse> {
  const p = (await db.select().from(project).where(eq(project.id, projectId)))[0];
  if (!p) throw new NotFoundError("No such project, or it is not shared with you");
  const [facades, rows, requirements, weather] = await Promise.all([
    db.select().from(facade).where(eq(facade.projectId, projectId)).orderBy(asc(facade.position), asc(facade.createdAt), asc(facade.id)),
    optionRows(projectId, opts.optionIds),
    requirementsEntry(projectId),
    weatherForResults(projectId),
  ]);
  const year = resultYear(requestedYear, weather);
  const facadeById = new Map(facades.map((f) => [f.id, f]));

  const entries: Entry[] = [];
  for (const r of rows) {
    const f = facadeById.get(r.option.facadeId);
    if (!f) continue;
    const surface = { name: `${f.name} · ${r.option.name}`.slice(0, 120), azimuthDeg: f.azimuthDeg, tiltDeg: f.tiltDeg, layers: r.revision.layers };
    const shading = shadingOf(f);
    const full = shading ? { ...surface, shading } : surface;
    const entry: Entry = {
      facade: f,
      option: r.option,
      makeupName: r.makeupName,
      revision: r.revision,
      key: sha256(stableJson(resultInputs(p, f, r.revision.layers, year, weather))),
      surface: full,
    };
    const check = ScheduleRequest.safeParse(yearRequestInput(p, year, [full], weather));
    if (!check.success) {
      const issue = check.error.issues[0]!;
      entry.problem = `The stored make-up or façade cannot be computed: ${pathText(issue.path.slice(2))}: ${issue.message}`;
    }
    entries.push(entry);
  }

  // Cache look-up: one query for every key.
  const keys = [...new Set(entries.filter((e) => !e.problem).map((e) => e.key))];
  const cached = new Map<string, CachedSummary>();
  if (keys.length) {
    const hits = await db.select({ key: resultCache.key, value: resultCache.value }).from(resultCache).where(inArray(resultCache.key, keys));
    for (const h of hits) cached.set(h.key, h.value as CachedSummary);
  }
  const hitCount = entries.filter((e) => !e.problem && cached.has(e.key)).length;

  // Compute the misses, ≤ 24 distinct surfaces per engine task.
  const missing = [...new Map(entries.filter((e) => !e.problem && !cached.has(e.key)).map((e) => [e.key, e])).values()];
  if (missing.length) {
    const pool = opts.pool === undefined ? sharedCalcPool() : opts.pool;
    const batches: Entry[][] = [];
    for (let i = 0; i < missing.length; i += MAX_SURFACES) batches.push(missing.slice(i, i + MAX_SURFACES));
    const computed = await Promise.all(
      batches.map((b) =>
        computeBatch(
          pool,
          ScheduleRequest.parse(
            yearRequestInput(
              p,
              year,
              b.map((e) => e.surface),
              weather,
            ),
          ),
        ),
      ),
    );
    const fresh: { key: string; projectId: string; value: CachedSummary }[] = [];
    batches.forEach((b, bi) =>
      b.forEach((e, k) => {
        const s = computed[bi]![k]!;
        const value: CachedSummary = { year, annual: s.annual, peak: s.peak, monthly: s.monthly };
        cached.set(e.key, value);
        fresh.push({ key: e.key, projectId, value });
      }),
    );
    await db.insert(resultCache).values(fresh).onConflictDoNothing();
  }

  // Prune what no current input reaches: this year's other keys at once, other years' after a while.
  const liveKeys = entries.map((e) => e.key);
  if (!opts.optionIds) {
    const old = sql`now() - make_interval(days => ${PRUNE_OTHER_YEARS_AFTER_DAYS})`;
    await db
      .delete(resultCache)
      .where(
        and(
          eq(resultCache.projectId, projectId),
          liveKeys.length ? notInArray(resultCache.key, liveKeys) : undefined,
          or(sql`(${resultCache.value}->>'year')::int = ${year}`, lt(resultCache.createdAt, old)),
        ),
      );
  }

  const byFacade = new Map<string, Entry[]>();
  for (const e of entries) byFacade.set(e.facade.id, [...(byFacade.get(e.facade.id) ?? []), e]);

  const facadeResults: FacadeResult[] = facades
    .filter((f) => !opts.optionIds || byFacade.has(f.id))
    .map((f) => {
      const limits = effectiveLimits(requirements.project, requirements.facades[f.id]);
      return {
        facadeId: f.id,
        name: f.name,
        azimuthDeg: f.azimuthDeg,
        tiltDeg: f.tiltDeg,
        glazedAreaM2: f.glazedAreaM2,
        limits,
        shading: shadingOf(f) ?? null,
        options: (byFacade.get(f.id) ?? []).map((e): OptionResult => {
          const s = e.problem ? emptySummary(year) : cached.get(e.key)!;
          const values = e.revision.values as MakeupValues;
          const light = makeupLight(values);
          const flags = requirementFlags(limits, {
            gValue: values.normal?.gValue ?? null,
            lightTransmittance: light.transmittance,
            lightTransmittanceRange: light.range,
            uValue: values.uValue ?? null,
            peakTransmittedWm2: e.problem ? null : s.peak.transmittedWm2,
            annualSolarGainKWhm2: e.problem ? null : s.annual.solarGainKWhm2,
          });
          return {
            optionId: e.option.id,
            name: e.option.name,
            status: e.option.status,
            makeupId: e.option.makeupId,
            makeupRevision: e.revision.revision,
            makeupName: e.makeupName,
            description: e.revision.description,
            values,
            annual: s.annual,
            peak: s.peak,
            monthly: s.monthly,
            flags,
            inputsKey: e.key,
            ...(e.problem ? { problem: e.problem } : {}),
          };
        }),
      };
    });

  const inputsKey = sha256(
    stableJson({
      engine: RESULTS_ENGINE_VERSION,
      year,
      weather: weather?.irradiance.sha256 ?? null,
      entries: entries.map((e) => [e.facade.id, e.option.id, e.option.name, e.option.status, e.revision.id, e.key]),
      facades: facadeResults.map((f) => [f.facadeId, f.name, f.glazedAreaM2, f.limits]),
    }),
  );
  return {
    projectId,
    year,
    inputsKey,
    computedAt: new Date().toISOString(),
    site: siteOf(p),
    irradiance: weather ? weather.irradiance : { source: "clear sky" },
    cache: { hits: hitCount, misses: missing.length },
    facades: facadeResults,
  };
}

/**
 * Two or more options side by side: their results for the year, their angular values (the stored layers
 * through the same engine as POST /calc/glazing) and each surface as POST /calc/schedule takes it, for a
 * day's hourly profile. NotFoundError naming the options that are not in this project.
 */
export async function compareOptions(
  projectId: string,
  optionIds: readonly string[],
  year: number,
  opts: Pick<ProjectResultsOptions, "pool"> = {},
): Promise<CompareResponse> {
  const results = await projectResults(projectId, year, { ...opts, optionIds });
  const found = new Map(results.facades.flatMap((f) => f.options.map((o) => [o.optionId, { f, o }] as const)));
  const missing = optionIds.filter((id) => !found.has(id));
  if (missing.length)
    throw new NotFoundError(`${missing.length === 1 ? "This option is" : "These options are"} not in this project: ${missing.join(", ")}`);
  const rows = await optionRows(projectId, optionIds);
  const layersOf = new Map(rows.map((r) => [r.option.id, r.revision.layers as unknown[]]));
  const facadeRows = new Map((await db.select().from(facade).where(eq(facade.projectId, projectId))).map((f) => [f.id, f]));
  const pool = opts.pool === undefined ? sharedCalcPool() : opts.pool;
  const options = await Promise.all(
    optionIds.map(async (id): Promise<CompareOption> => {
      const { f, o } = found.get(id)!;
      const layers = layersOf.get(id) ?? [];
      let angles: CompareOption["angles"] = [];
      const req = GlazingRequest.safeParse({ layers, anglesDeg: COMPARE_ANGLES_DEG });
      if (req.success && !o.problem) {
        angles = (await runCalc<"glazing", GlazingResponse>(pool, "glazing", req.data)).angles;
      }
      const shading = shadingOf(facadeRows.get(f.facadeId)!);
      return {
        ...o,
        facadeId: f.facadeId,
        facadeName: f.name,
        angles,
        surface: {
          name: `${f.name} · ${o.name}`.slice(0, 120),
          azimuthDeg: f.azimuthDeg,
          tiltDeg: f.tiltDeg,
          layers,
          ...(shading ? { shading } : {}),
        },
      };
    }),
  );
  return { projectId, year: results.year, inputsKey: results.inputsKey, site: results.site!, irradiance: results.irradiance, options };
}
