// Hourly schedules: a full year at 60 minutes for 24 surfaces × 3 glazing options (72 series × 8,760 rows,
// every column, clear sky with the Perez anisotropic sky, overhang and fins on every window), against
// (a) the floor: a bare loop that only computes the incidence (dot product) and interpolates τ from a
// typed array for the same 72 series, and (b) evaluating the Fresnel stack directly at every sunlit hour.
// Also the endpoint handler for one surface and a full year (validation + compute + JSON, in process).
import { ScheduleRequest, type ScheduleRequestInput } from "@/lib/contracts/schedule";
import { PRESETS } from "@/lib/glazing-presets";
import {
  allocateColumns,
  computeSurfaceSeries,
  prepareGlazingTables,
  prepareSite,
  prepareSurface,
  type GlazingTables,
  type PreparedSurface,
  type SiteSeries,
  type SurfaceColumns,
} from "@/lib/calc/schedule";
import { prepareGlazingModel } from "@/lib/calc/glazing";
import { asRadians } from "@/lib/physics/units";
import { POST } from "@/pages/api/v1/calc/schedule";

const YEAR = 2026;
const site = { latitudeDeg: 38.7053, longitudeDeg: -9.1721, timeZone: "Europe/Lisbon", elevationM: 12 };
const options = ["double-air", "double-lowe", "triple"].map((id) => PRESETS.find((p) => p.id === id)!.request.layers);
const shading = { window: { widthM: 1.5, heightM: 1.8 }, overhang: { depthM: 0.6, gapAboveM: 0.2 }, fins: { depthM: 0.3, gapM: 0.1 } };
const body: ScheduleRequestInput = {
  site,
  from: `${YEAR}-01-01`,
  to: `${YEAR}-12-31`,
  stepMinutes: 60,
  sky: { model: "perez" },
  surfaces: Array.from({ length: 24 }, (_, k) => ({ name: `S${k}`, azimuthDeg: k * 15, tiltDeg: 90, layers: options[0]!, shading })),
};

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
function time(f: () => void, trials: number): number {
  f();
  f(); // warm-up
  const t: number[] = [];
  for (let k = 0; k < trials; k++) {
    const t0 = performance.now();
    f();
    t.push(performance.now() - t0);
  }
  return median(t);
}

export async function run(): Promise<void> {
  const req = ScheduleRequest.parse(body);
  const surfacesIn = req.surfaces;
  const first = body.surfaces[0] as Record<string, unknown>;
  const glazingReqs = options.map((layers) => ScheduleRequest.parse({ ...body, surfaces: [{ ...first, layers }] }).surfaces[0]!.glazing);

  let siteSeries!: SiteSeries;
  let tables!: GlazingTables[];
  let prepared!: PreparedSurface[];
  const n = 8760;
  const columns: SurfaceColumns[] = Array.from({ length: 72 }, () => allocateColumns(n));

  const tSite = time(() => {
    siteSeries = prepareSite(req.site, req, req.sky);
  }, 9);
  const tTables = time(() => {
    tables = glazingReqs.map(prepareGlazingTables);
  }, 9);
  const tSurfacesUncached = time(() => {
    prepared = surfacesIn.map((s) => prepareSurface(s, req.sky.albedo));
  }, 5);
  const tSurfaces = time(() => {
    const cache = new Map();
    prepared = surfacesIn.map((s) => prepareSurface(s, req.sky.albedo, cache));
  }, 9);
  const loops = () => {
    let k = 0;
    for (const s of prepared) for (const g of tables) computeSurfaceSeries(siteSeries, s, g, columns[k++]!);
  };
  const tLoops = time(loops, 11);
  const tAll = time(() => {
    siteSeries = prepareSite(req.site, req, req.sky);
    tables = glazingReqs.map(prepareGlazingTables);
    const cache = new Map();
    prepared = surfacesIn.map((s) => prepareSurface(s, req.sky.albedo, cache));
    loops();
  }, 9);

  // The floor: incidence + τ interpolated from the table's typed array, nothing else.
  const floorOut = new Float64Array(n);
  const floor = () => {
    const { east, north, up } = siteSeries.sun;
    for (const s of prepared) {
      const { east: nE, north: nN, up: nU } = s.frame.normal;
      for (const g of tables) {
        const v = g.tau.cosGridValues;
        const m = g.tau.intervals;
        for (let i = 0; i < n; i++) {
          const c = nE * east[i]! + nN * north[i]! + nU * up[i]!;
          let t = 0;
          if (c > 0) {
            const x = Math.sqrt(c < 1 ? c : 1) * m;
            const j = x < m ? x | 0 : m - 1;
            t = v[j]! + (x - j) * (v[j + 1]! - v[j]!);
          }
          floorOut[i] = t;
        }
      }
    }
  };
  const tFloor = time(floor, 11);

  // Direct: the Fresnel stack evaluated at every sunlit hour instead of the table.
  const models = glazingReqs.map((g) => prepareGlazingModel(g));
  let sunlitRows = 0;
  const direct = () => {
    const { east, north, up } = siteSeries.sun;
    sunlitRows = 0;
    for (const s of prepared) {
      const { east: nE, north: nN, up: nU } = s.frame.normal;
      for (const m of models) {
        for (let i = 0; i < n; i++) {
          const c = nE * east[i]! + nN * north[i]! + nU * up[i]!;
          floorOut[i] = up[i]! > 0 && c > 0 ? m.optics.at(asRadians(Math.acos(Math.min(1, c)))).solar.T : 0;
          if (up[i]! > 0 && c > 0) sunlitRows++;
        }
      }
    }
  };
  const tDirect = time(direct, 3);

  const rows = 72 * siteSeries.timeline.length;
  console.log(
    `72 series × ${siteSeries.timeline.length} rows = ${rows.toLocaleString("en")} rows, Perez sky, overhang + fins on every window (medians)`,
  );
  console.log(`  shared per site: timeline + sun + clear sky + Perez coefficients  ${tSite.toFixed(1)} ms`);
  console.log(`  per glazing option (3): angular tables τ(θ), g(θ), hemispherical   ${tTables.toFixed(1)} ms`);
  console.log(
    `  per surface (24, one window type): frames, shading, diffuse view factors ${tSurfaces.toFixed(1)} ms (${tSurfacesUncached.toFixed(1)} ms if every window differed)`,
  );
  console.log(
    `  hot loops, 72 series, every column                                ${tLoops.toFixed(1)} ms (${((tLoops * 1e6) / rows).toFixed(1)} ns/row)`,
  );
  console.log(
    `  whole computation                                                 ${tAll.toFixed(1)} ms   target ≤ 100 ms: ${tAll <= 100 ? "PASS" : "MISS"}`,
  );
  console.log(
    `  floor (incidence + τ lookup only)                                 ${tFloor.toFixed(1)} ms (${((tFloor * 1e6) / rows).toFixed(1)} ns/row)`,
  );
  console.log(
    `  ratio hot loops / floor ${(tLoops / tFloor).toFixed(2)}×   target ≤ 5×: ${tLoops / tFloor <= 5 ? "PASS" : "MISS"};  whole computation / floor ${(tAll / tFloor).toFixed(2)}×`,
  );
  console.log(
    `  direct Fresnel stack at every sunlit hour (${sunlitRows.toLocaleString("en")} evaluations, τ only) ${tDirect.toFixed(0)} ms = ${(tDirect / tLoops).toFixed(1)}× the hot loops`,
  );

  // Through the endpoint handler: one surface, a full year, validation + compute + JSON text.
  const one = JSON.stringify({ ...body, surfaces: [{ ...first, name: "South", azimuthDeg: 180 }] });
  const ctx = () =>
    ({
      request: new Request("http://127.0.0.1/api/v1/calc/schedule", { method: "POST", headers: { "content-type": "application/json" }, body: one }),
      locals: { user: { id: "bench" } },
      url: new URL("http://127.0.0.1/api/v1/calc/schedule"),
    }) as never;
  let bytes = 0;
  const apiTimes: number[] = [];
  for (let k = 0; k < 13; k++) {
    const t0 = performance.now();
    const res = await POST(ctx());
    const text = await res.text();
    if (res.status !== 200) throw new Error(`endpoint answered ${res.status}: ${text.slice(0, 200)}`);
    bytes = text.length;
    if (k >= 2) apiTimes.push(performance.now() - t0);
  }
  const tApi = median(apiTimes);
  console.log(
    `  endpoint, one surface × 8,760 rows (validation + compute + JSON ${(bytes / 1e6).toFixed(1)} MB, in process) ${tApi.toFixed(0)} ms   target ≤ 200 ms: ${tApi <= 200 ? "PASS" : "MISS"}`,
  );
}
