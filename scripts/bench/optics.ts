/**
 * Benchmark of the glazing optics core (src/lib/physics). Prints plain-text medians over
 * repeated trials, each figure with its target and PASS/MISS. Machines are shared and noisy:
 * every measurement is warmed up first and reported as the median of ≥ 7 trials.
 *
 * Run alone from the repository root:
 *   npx tsx -e 'import("./scripts/bench/optics.ts").then(m=>m.run())'
 */
import { absorbingPaneOptics, checkAbsorbingPane, absorbingPaneOpticsUnchecked } from "@/lib/physics/absorbing-pane";
import { AngularTable } from "@/lib/physics/angular-table";
import { measuredBandAtUnchecked, prepareMeasuredPane } from "@/lib/physics/measured-pane";
import { prepareGlazing, type PaneSpec, type PreparedGlazing } from "@/lib/physics/optics";
import { asRadians, type Radians } from "@/lib/physics/units";

const TRIALS = 9;

const clear4mm: PaneSpec = { kind: "physical", thicknessM: 0.004, refractiveIndex: 1.52, absorptionPerM: 20 };
// A hypothetical coated pane (not a product): outer face reflects more than the inner one.
const coated4mm: PaneSpec = {
  kind: "measured",
  thicknessM: 0.004,
  solar: { T: 0.52, Rf: 0.3, Rb: 0.22 },
  visible: { T: 0.7, Rf: 0.12, Rb: 0.1 },
};
const tripleClear: PaneSpec[] = [clear4mm, clear4mm, clear4mm];
const tripleCoated: PaneSpec[] = [coated4mm, clear4mm, clear4mm];

const median = (xs: number[]): number => {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m]! : 0.5 * (s[m - 1]! + s[m]!);
};

const nowMs = (): number => performance.now();

/** Median wall time [ms] of one call of fn, each trial repeating fn `reps` times. */
function timeMs(fn: () => void, reps: number, trials = TRIALS): number {
  for (let i = 0; i < Math.max(3, reps >> 2); i++) fn(); // warm-up
  const per: number[] = [];
  for (let t = 0; t < trials; t++) {
    const t0 = nowMs();
    for (let i = 0; i < reps; i++) fn();
    per.push((nowMs() - t0) / reps);
  }
  return median(per);
}

const verdict = (ok: boolean): string => (ok ? "PASS" : "MISS");
const deg = (d: number): Radians => asRadians((d * Math.PI) / 180);

let sink = 0; // defeats dead-code elimination

function tableAndHemispherical(panes: PaneSpec[]): void {
  const g = prepareGlazing(panes);
  for (let d = 0; d <= 90; d++) sink += g.at(deg(d)).solar.T;
  sink += g.hemispherical().solar.T;
}

/** Pseudo-random cos θ values in [−0.2, 1] (some behind the surface), xorshift32, fixed seed. */
function randomCosines(count: number): Float64Array {
  const out = new Float64Array(count);
  let x = 0x9e3779b9 | 0;
  for (let i = 0; i < count; i++) {
    x ^= x << 13;
    x ^= x >>> 17;
    x ^= x << 5;
    out[i] = ((x >>> 0) / 4294967296) * 1.2 - 0.2;
  }
  return out;
}

function lookupsPerSecond(table: AngularTable, inputs: Float64Array, byAngle: boolean): number {
  const passes = 8;
  const run = (): void => {
    let acc = 0;
    for (let p = 0; p < passes; p++) {
      if (byAngle) for (let i = 0; i < inputs.length; i++) acc += table.at(inputs[i]!);
      else for (let i = 0; i < inputs.length; i++) acc += table.atCos(inputs[i]!);
    }
    sink += acc;
  };
  const ms = timeMs(run, 1);
  return (passes * inputs.length) / (ms / 1000);
}

function maxTableError(g: PreparedGlazing): { worst: number; where: string } {
  const n = g.paneCount;
  const names = ["T", "Rf", "Rb", ...Array.from({ length: n }, (_, k) => `A${k + 1}`)];
  const pick = (th: Radians): number[] => {
    const s = g.at(th).solar;
    return [s.T, s.Rf, s.Rb, ...s.absorptanceFront];
  };
  const tables = names.map((_, j) => AngularTable.fromFunction((th) => pick(th)[j]!));
  let worst = 0;
  let where = "";
  const steps = 90_000; // 0.001°
  for (let i = 0; i <= steps; i++) {
    const th = asRadians(((i / steps) * Math.PI) / 2);
    const direct = pick(th);
    for (let j = 0; j < names.length; j++) {
      const t = tables[j]!;
      const e = Math.max(Math.abs(t.at(th) - direct[j]!), Math.abs(t.atCos(Math.cos(th)) - direct[j]!));
      if (e > worst) {
        worst = e;
        where = `${names[j]} at ${((i / steps) * 90).toFixed(3)}°`;
      }
    }
  }
  return { worst, where };
}

export async function run(): Promise<void> {
  console.log("Paneray optics benchmark (medians of %d trials, after warm-up)", TRIALS);
  console.log(`node ${process.version}`);

  // (1) 91-angle table + hemispherical values for a triple glazing, including preparation.
  const t1 = timeMs(() => tableAndHemispherical(tripleClear), 50);
  console.log(
    `(1a) triple 3 × 4 mm (n=1.52, α=0.02/mm): prepare + 91-angle table (0..90° step 1°) + hemispherical: ` +
      `${t1.toFixed(3)} ms   target ≤ 0.5 ms   ${verdict(t1 <= 0.5)}`,
  );
  const t1c = timeMs(() => tableAndHemispherical(tripleCoated), 50);
  console.log(`(1b) same with the outer pane coated (measured T/Rf/Rb): ${t1c.toFixed(3)} ms   target ≤ 0.5 ms   ${verdict(t1c <= 0.5)}`);

  // (2) direct evaluation per pane per angle.
  const angles = Array.from({ length: 1000 }, (_, i) => asRadians(((i + 0.5) / 1000) * (Math.PI / 2)));
  const pane = checkAbsorbingPane({ thicknessM: 0.004, refractiveIndex: 1.52, absorptionPerM: 20 });
  const perPaneChecked =
    timeMs(() => {
      for (const th of angles) sink += absorbingPaneOptics(pane, th).T;
    }, 50) / angles.length;
  const perPane =
    timeMs(() => {
      for (const th of angles) sink += absorbingPaneOpticsUnchecked(pane, th).T;
    }, 50) / angles.length;
  const coatedBand = prepareMeasuredPane({ thicknessM: 0.004, solar: { T: 0.52, Rf: 0.3, Rb: 0.22 } }).solar;
  const perCoated =
    timeMs(() => {
      for (const th of angles) sink += measuredBandAtUnchecked(coatedBand, th).s.T;
    }, 50) / angles.length;
  const triple = prepareGlazing(tripleClear);
  const perTripleAngle =
    timeMs(() => {
      for (const th of angles) sink += triple.at(th).solar.T;
    }, 20) / angles.length;
  const ns = (ms: number): string => `${(ms * 1e6).toFixed(0)} ns`;
  console.log(
    `(2a) uncoated pane, s+p slab, one angle: ${ns(perPane)} (with input checks ${ns(perPaneChecked)})   ` +
      `target < 1 µs   ${verdict(perPaneChecked < 1e-3)}`,
  );
  console.log(`(2b) coated measured pane, one band, one angle: ${ns(perCoated)}   target < 1 µs   ${verdict(perCoated < 1e-3)}`);
  console.log(
    `(2c) whole triple glazing at one angle (3 panes, s and p stacks): ${ns(perTripleAngle)} = ` +
      `${ns(perTripleAngle / 3)} per pane   target < 1 µs per pane   ${verdict(perTripleAngle / 3 < 1e-3)}`,
  );

  // (3) angular-table lookups per second, one core, pseudo-random angles.
  const table = AngularTable.fromFunction((th) => triple.at(th).solar.T);
  const cosines = randomCosines(1 << 20);
  const thetas = cosines.map((u) => Math.acos(u));
  const lpsCos = lookupsPerSecond(table, cosines, false);
  const lpsAngle = lookupsPerSecond(table, thetas, true);
  console.log(`(3a) table lookups by cos θ: ${(lpsCos / 1e6).toFixed(0)} million/s   target ≥ 50 million/s   ${verdict(lpsCos >= 50e6)}`);
  console.log(`(3b) table lookups by θ [rad]: ${(lpsAngle / 1e6).toFixed(0)} million/s   ` + `target ≥ 50 million/s   ${verdict(lpsAngle >= 50e6)}`);
  const tBuild = timeMs(() => {
    sink += AngularTable.fromFunction((th) => triple.at(th).solar.T).cosGridValues[7]!;
  }, 3);
  console.log(`     (building one table (2 grids × 1025 points) of the triple glazing: ${tBuild.toFixed(2)} ms, once per glazing)`);

  // (4) interpolation error vs direct evaluation, 0..90° in 0.001° steps, every quantity.
  for (const [label, panes] of [
    ["triple clear", tripleClear],
    ["triple, outer coated", tripleCoated],
  ] as const) {
    const { worst, where } = maxTableError(prepareGlazing(panes));
    console.log(
      `(4) max interpolation error, ${label} (T, Rf, Rb, each A; 90 001 angles; both lookups): ${worst.toExponential(2)} (${where})   ` +
        `target ≤ 1e-5   ${verdict(worst <= 1e-5)}`,
    );
  }
  if (!Number.isFinite(sink)) console.log("(sink)", sink);
}
