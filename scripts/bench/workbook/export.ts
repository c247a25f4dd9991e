// One workbook export for the workbook bench, in a process of its own so that its peak RSS is the export's:
// 24 façades round the compass (every other one with a window under an overhang and fins, each with a glazed
// area), each with an approved option, a full year hourly (24 × 8,760 = 210,240 rows), written through the
// calculation pool into a sink that counts the bytes. Prints one JSON line: { ms, bytes, rows, maxRssMB }.
import { Writable } from "node:stream";
import { writeWorkbookPlan, type WorkbookPlan } from "@/lib/server/services/workbook";
import { writeWorkbookInThread } from "@/lib/server/workbook-thread";
import { calculateGlazing } from "@/lib/calc/glazing";
import { GlazingRequest } from "@/lib/contracts/glazing";
import { sharedCalcPool } from "@/lib/server/calc-pool";
import { MAKEUPS } from "../data/makeups";

const YEAR = 2026;
const FACADES = 24;

const projectRow = {
  id: "bench-project",
  organizationId: "bench-org",
  name: "Bench workbook block",
  description: null,
  siteName: "Bench quay",
  latitudeDeg: 38.7053,
  longitudeDeg: -9.1721,
  timeZone: "Europe/Lisbon",
  elevationM: 12,
  groundAlbedo: 0.2,
  skyModel: "perez",
  linkeTurbidity: null,
} as unknown as WorkbookPlan["project"];

function plan(): WorkbookPlan {
  const values = MAKEUPS.map((m) => {
    const g = calculateGlazing(GlazingRequest.parse({ layers: m.layers }));
    return { normal: g.angles[0]!, hemispherical: g.hemispherical, uValue: g.uValue, warnings: g.warnings, light: g.light };
  });
  const schedule: WorkbookPlan["schedule"] = [];
  const hourly: WorkbookPlan["hourly"] = [];
  for (let k = 0; k < FACADES; k++) {
    const m = k % MAKEUPS.length;
    const f = { azimuthDeg: k * 15, tiltDeg: 90 };
    const shading =
      k % 2 ? { window: { widthM: 1.5, heightM: 1.8 }, overhang: { depthM: 0.6, gapAboveM: 0.2 }, fins: { depthM: 0.3, gapM: 0.1 } } : undefined;
    const name = `Façade ${k + 1}`;
    schedule.push({
      facadeId: `f${k}`,
      facadeName: name,
      ...f,
      glazedAreaM2: 80,
      option: {
        name: `Option ${m + 1}`,
        makeupName: MAKEUPS[m]!.name,
        makeupRevision: 1,
        description: MAKEUPS[m]!.name,
        values: values[m]!,
        annual: { transmittedKWhm2: 0, solarGainKWhm2: 0 },
        peak: { transmittedWm2: 0, at: null },
        flags: [],
      },
    });
    hourly.push({
      facadeId: `f${k}`,
      facadeName: name,
      optionName: `Option ${m + 1}`,
      glazedAreaM2: 80,
      surface: { name, ...f, layers: MAKEUPS[m]!.layers, ...(shading ? { shading } : {}), glazedAreaM2: 80 },
      makeupKey: `m${m}`,
    });
  }
  return {
    project: projectRow,
    fileName: "Bench.xlsx",
    draft: false,
    revision: { letter: "A", issuedAt: new Date().toISOString(), issuedBy: "Bench", note: null },
    year: YEAR,
    irradiance: { source: "clear sky" },
    site: { ...projectRow, name: projectRow.siteName, linkeTurbidity: null } as unknown as WorkbookPlan["site"],
    schedule,
    hourly,
    makeups: MAKEUPS.map((m, i) => ({ key: `m${i}`, name: m.name, revision: 1, layers: m.layers })),
    requestBase: { project: projectRow, year: YEAR, weather: null },
  };
}

const p = plan();
let bytes = 0;
const sink = new Writable({
  write(chunk: Buffer, _enc, cb) {
    bytes += chunk.length;
    cb();
  },
});
const finished = new Promise<void>((resolve, reject) => sink.on("finish", resolve).on("error", reject));
const t0 = performance.now();
// As the download route writes it: on an export thread (BENCH_IN_PROCESS=1: on this thread through the pool).
if (process.env.BENCH_IN_PROCESS === "1") await writeWorkbookPlan(p, sink, { pool: sharedCalcPool() });
else await writeWorkbookInThread(p, sink);
await finished;
const ms = performance.now() - t0;
console.log(JSON.stringify({ ms, bytes, rows: p.hourly.length * 8760, maxRssMB: process.resourceUsage().maxRSS / 1024 }));
process.exit(0);
