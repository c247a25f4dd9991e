// The whole glazing calculation as the API runs it (request already validated): a 91-angle table plus
// hemispherical values, g at every angle, EN 673 U-value and warnings, for triple glazings.
import { GlazingRequest, type GlazingRequestInput } from "@/lib/contracts/glazing";
import { calculateGlazing } from "@/lib/calc/glazing";

const clear = { kind: "pane", thicknessMm: 4, refractiveIndex: 1.52, absorptionPerMm: 0.02 } as const;
const coated = {
  kind: "pane",
  thicknessMm: 4,
  emissivityBack: 0.03,
  measured: {
    solarTransmittance: 0.55,
    solarReflectanceFront: 0.22,
    solarReflectanceBack: 0.27,
    visibleTransmittance: 0.8,
    visibleReflectanceFront: 0.05,
    visibleReflectanceBack: 0.05,
  },
} as const;
const gap = { kind: "gap", widthMm: 12, gas: "krypton" } as const;
const angles = Array.from({ length: 91 }, (_, i) => i);

const cases: [string, GlazingRequestInput][] = [
  ["triple clear 4|12Kr|4|12Kr|4", { layers: [clear, gap, clear, gap, clear], anglesDeg: angles }],
  ["triple, outer pane coated (measured)", { layers: [coated, gap, clear, gap, clear], anglesDeg: angles }],
];

function medianMs(f: () => void, inner: number, trials = 11): number {
  for (let i = 0; i < inner * 2; i++) f(); // warm-up
  const t: number[] = [];
  for (let k = 0; k < trials; k++) {
    const t0 = performance.now();
    for (let i = 0; i < inner; i++) f();
    t.push((performance.now() - t0) / inner);
  }
  t.sort((a, b) => a - b);
  return t[Math.floor(trials / 2)]!;
}

export async function run(): Promise<void> {
  const target = 0.5;
  for (const [label, body] of cases) {
    const req = GlazingRequest.parse(body);
    let sink = 0;
    const calc = medianMs(() => {
      sink += calculateGlazing(req).uValue;
    }, 400);
    const withParse = medianMs(() => {
      sink += calculateGlazing(GlazingRequest.parse(body)).uValue;
    }, 400);
    const withJson = medianMs(() => {
      sink += JSON.stringify(calculateGlazing(GlazingRequest.parse(body))).length;
    }, 200);
    console.log(
      `${label}: calculation ${calc.toFixed(3)} ms (target ≤ ${target} ms: ${calc <= target ? "PASS" : "MISS"}); ` +
        `+ validation ${withParse.toFixed(3)} ms; + JSON ${withJson.toFixed(3)} ms  [median of 11 trials; checksum ${sink.toExponential(3)}]`,
    );
  }
}
