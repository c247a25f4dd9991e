/**
 * Reference cases: fill-gas properties at the EN 673 mean temperature (10 °C, 283 K) and the EN 673
 * rule that mixes them linearly by volume fraction.
 *
 * Pure data. Inputs name a pure gas or volume fractions; expected values are in SI units
 * (kg/m³, kg/(m·s), W/(m·K), J/(kg·K)). The computed values are reproduced by
 * `npx tsx scripts/reference/gas-properties.ts`.
 */
import { half } from "./build";
import type { CaseSource, ReferenceCase, ReferenceDomain } from "./types";

/** A pure gas as EN 673 tabulates it. */
export type GasNameData = "air" | "argon" | "krypton";

/** A cavity fill: a pure gas or volume fractions summing to 1, e.g. `{ argon: 0.9, air: 0.1 }`. */
export type GasFillData = GasNameData | { readonly air?: number; readonly argon?: number; readonly krypton?: number };

export interface GasPropertiesCaseInput {
  readonly gas: GasFillData;
}

export type GasPropertiesCase = ReferenceCase<GasPropertiesCaseInput>;

const EN673_GAS_TABLE: CaseSource = {
  kind: "published",
  citation:
    "EN 673:2011, Glass in building — Determination of thermal transmittance (U value) — Calculation method, " +
    'clause 6 "Basic material properties", gas property table at θ_m = 10 °C (table values from memory; clause confirmed)',
  fromMemory: true,
};

const PRANDTL: CaseSource = {
  kind: "computed",
  formula: "Pr = μ c / λ (EN 673:2011 clause 5, basic formulae; equation from memory) with the EN 673:2011 clause 6 gas table at 10 °C",
  script: "scripts/reference/gas-properties.ts",
  fromMemory: true,
};

const MIXING: CaseSource = {
  kind: "closed-form",
  formula: "P_mix = Σ F_i P_i for ρ, μ, λ and c separately, with the EN 673:2011 clause 6 gas table at 10 °C",
  citation: "EN 673:2011 clause 6, gas mixtures mixed linearly by volume fraction (from memory)",
};

/** Stored as printed: the engine's table must equal it exactly. */
const AS_PRINTED = { abs: 0, reason: "stored as printed (4 significant digits): exact equality" } as const;

const tabulated = (
  gas: GasNameData,
  densityKgPerM3: number,
  dynamicViscosityPaS: number,
  conductivityWPerMK: number,
  specificHeatJPerKgK: number,
): GasPropertiesCase => ({
  id: `gas-properties/${gas}/10C`,
  label: `${gas} at 10 °C: ρ, μ, λ, c as tabulated in EN 673`,
  input: { gas },
  expected: [
    { quantity: "densityKgPerM3", unit: "kg/m³", value: densityKgPerM3, tolerance: AS_PRINTED },
    { quantity: "dynamicViscosityPaS", unit: "kg/(m·s)", value: dynamicViscosityPaS, tolerance: AS_PRINTED },
    { quantity: "conductivityWPerMK", unit: "W/(m·K)", value: conductivityWPerMK, tolerance: AS_PRINTED },
    { quantity: "specificHeatJPerKgK", unit: "J/(kg·K)", value: specificHeatJPerKgK, tolerance: AS_PRINTED },
  ],
  source: EN673_GAS_TABLE,
});

const HALF_6TH_DECIMAL = half(6);

export const gasPropertiesCases: readonly GasPropertiesCase[] = [
  tabulated("air", 1.232, 1.761e-5, 2.496e-2, 1008),
  tabulated("argon", 1.699, 2.164e-5, 1.684e-2, 519),
  tabulated("krypton", 3.56, 2.4e-5, 0.9e-2, 245),
  {
    id: "gas-properties/air/prandtl",
    label: "air at 10 °C: Prandtl number μc/λ = 0.711173",
    input: { gas: "air" },
    expected: [{ quantity: "prandtl", unit: "-", value: 0.711173, tolerance: HALF_6TH_DECIMAL }],
    source: PRANDTL,
  },
  {
    id: "gas-properties/argon/prandtl",
    label: "argon at 10 °C: Prandtl number μc/λ = 0.666933",
    input: { gas: "argon" },
    expected: [{ quantity: "prandtl", unit: "-", value: 0.666933, tolerance: HALF_6TH_DECIMAL }],
    source: PRANDTL,
  },
  {
    id: "gas-properties/argon90-air10/mixed",
    label: "90 % argon / 10 % air: every property mixed by volume fraction",
    input: { gas: { argon: 0.9, air: 0.1 } },
    expected: [
      // 0.9·1.699 + 0.1·1.232
      { quantity: "densityKgPerM3", unit: "kg/m³", value: 1.6523, tolerance: { abs: 5e-13, reason: "float64 rounding only (12 decimals)" } },
      // 0.9·2.164e-5 + 0.1·1.761e-5; checked as the ratio to this value, to 12 decimals
      {
        quantity: "dynamicViscosityPaS",
        unit: "kg/(m·s)",
        value: 2.1237e-5,
        tolerance: { abs: 5e-13 * 2.1237e-5, reason: "float64 rounding only: relative 5e-13" },
      },
      // 0.9·1.684e-2 + 0.1·2.496e-2; checked as the ratio to this value, to 12 decimals
      {
        quantity: "conductivityWPerMK",
        unit: "W/(m·K)",
        value: 1.7652e-2,
        tolerance: { abs: 5e-13 * 1.7652e-2, reason: "float64 rounding only: relative 5e-13" },
      },
      // 0.9·519 + 0.1·1008
      { quantity: "specificHeatJPerKgK", unit: "J/(kg·K)", value: 567.9, tolerance: { abs: 5e-10, reason: "float64 rounding only (9 decimals)" } },
    ],
    source: MIXING,
  },
  {
    id: "gas-properties/argon90-air10/prandtl",
    label: "90 % argon / 10 % air: Prandtl number of the mixed properties = 0.683237",
    input: { gas: { argon: 0.9, air: 0.1 } },
    // 2.1237e-5 · 567.9 / 1.7652e-2
    expected: [{ quantity: "prandtl", unit: "-", value: 0.683237, tolerance: HALF_6TH_DECIMAL }],
    source: {
      kind: "computed",
      formula:
        "Pr = μ c / λ of the properties mixed linearly by volume fraction (EN 673:2011 clauses 5 and 6, from memory), " +
        "EN 673:2011 clause 6 gas table at 10 °C",
      script: "scripts/reference/gas-properties.ts",
      fromMemory: true,
    },
  },
];

export const gasPropertiesDomain: ReferenceDomain<GasPropertiesCaseInput> = {
  domain: "gas-properties",
  title: "Fill-gas properties at 10 °C and gas mixtures (EN 673:2011)",
  cases: gasPropertiesCases,
};
