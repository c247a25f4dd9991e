/**
 * Reference cases: centre-of-glass U value per EN 673:2011 under the declared conditions (vertical, h_e 23,
 * h_i = 3.6 + 4.4 ε_i/0.837, ΔT 15 K, T_m 283 K, glass λ 1.0 W/(mK)), its intermediate values, and the
 * convection constants.
 *
 * Pure data. Thicknesses and widths in mm, emissivities as fractions, tilt in degrees from horizontal;
 * uncoated glass faces have ε = 0.837. The computed values are reproduced by
 * `npx tsx scripts/reference/u-value.ts`.
 *
 * Tolerances: U and h_s printed to 5 decimals → 5e-6; values printed to 6 decimals → 5e-7; Gr and Gr·Pr
 * printed to 2 decimals → 0.005. Two float64 implementations of the same formulae agree to ~1e-12, so
 * anything outside half a printed unit is a real disagreement.
 */
import { half } from "./build";
import type { CaseSource, ExpectedValue, ReferenceCase, ReferenceDomain } from "./types";

/** A cavity fill: a pure gas or volume fractions summing to 1, e.g. `{ argon: 0.9, air: 0.1 }`. */
export type UValueGasFill = "air" | "argon" | "krypton" | { readonly air?: number; readonly argon?: number; readonly krypton?: number };

/** A pane: thickness in mm; corrected emissivity of the outdoor-facing (front) and room-facing (back) face. */
export interface UValuePaneData {
  readonly thicknessMm: number;
  readonly emissivityFront: number;
  readonly emissivityBack: number;
}

export interface UValueGapData {
  readonly widthMm: number;
  readonly gas: UValueGasFill;
}

/**
 * What a case feeds to the engine:
 * - `unit`: a glazing unit (panes outdoor first), optionally with a non-declared h_e or tilt;
 * - `radiative-conductance`: h_r between two surfaces at T_m 283 K;
 * - `internal-coefficient`: h_i for a room-side emissivity;
 * - `convection-onset`: the gap width at which Nu reaches 1 (vertical, ΔT 15 K, T_m 283 K);
 * - `nusselt`: Nu for a given Gr·Pr and tilt;
 * - `convection-constants`: the tabulated A and n for a tilt.
 * Quantities named `gap.…` apply to every gap of the unit.
 */
export type UValueCaseInput =
  | {
      readonly kind: "unit";
      readonly panes: readonly UValuePaneData[];
      readonly gaps: readonly UValueGapData[];
      readonly externalCoefficientWPerM2K?: number;
      readonly tiltDeg?: number;
    }
  | { readonly kind: "radiative-conductance"; readonly emissivity1: number; readonly emissivity2: number }
  | { readonly kind: "internal-coefficient"; readonly roomSideEmissivity: number }
  | { readonly kind: "convection-onset"; readonly gas: "air" | "argon" | "krypton" }
  | { readonly kind: "nusselt"; readonly grashofPrandtl: number; readonly tiltDeg: number }
  | { readonly kind: "convection-constants"; readonly tiltDeg: number };

export type UValueCase = ReferenceCase<UValueCaseInput>;

const UNCOATED = 0.837;
const pane = (thicknessMm: number, emissivityFront = UNCOATED, emissivityBack = UNCOATED): UValuePaneData => ({
  thicknessMm,
  emissivityFront,
  emissivityBack,
});
/** 4 / gap / 4, coating of emissivity e on face 2 (facing the gap). */
const double = (gapMm: number, gas: UValueGasFill, e = UNCOATED) => ({
  panes: [pane(4, UNCOATED, e), pane(4)],
  gaps: [{ widthMm: gapMm, gas }],
});
/** 4 / gap / 4 / gap / 4, coatings of emissivity e on faces 2 and 5 (both facing a gap). */
const triple = (gapMm: number, gas: UValueGasFill, e: number) => ({
  panes: [pane(4, UNCOATED, e), pane(4), pane(4, e, UNCOATED)],
  gaps: [
    { widthMm: gapMm, gas },
    { widthMm: gapMm, gas },
  ],
});
const AR90: UValueGasFill = { argon: 0.9, air: 0.1 };

const EN673_FORMULA =
  "EN 673:2011 centre-of-glass U: 1/U = 1/h_e + Σ d/λ + Σ 1/h_s + 1/h_i; h_s = h_r + h_g; " +
  "h_r = 4σ(1/ε1 + 1/ε2 − 1)⁻¹ T_m³; h_g = Nu λ/s; Nu = A (Gr·Pr)^n, at least 1; Gr = 9.81 s³ ΔT ρ²/(T_m μ²); " +
  "Pr = μc/λ; h_i = 3.6 + 4.4 ε_i/0.837; multiple gaps: ΔT split ∝ 1/h_s; gas table of clause 6 " +
  "(EN 673:2011 clauses 5–8; equations and constants from memory, clause titles confirmed)";
const EN673: CaseSource = { kind: "computed", formula: EN673_FORMULA, script: "scripts/reference/u-value.ts", fromMemory: true };
const EN673_ROUNDED: CaseSource = {
  kind: "computed",
  formula: `${EN673_FORMULA}; U declared to one decimal (EN 673:2011 clause 9 "Expression of the results", from memory)`,
  script: "scripts/reference/u-value.ts",
  fromMemory: true,
};
const COMMON_PUBLISHED: CaseSource = {
  kind: "common-practice",
  note: "common published rounded U value (or range) for this build-up, from memory; no single source",
};

const U_TOL = half(5);
const HALF_6TH = half(6);
const HALF_2ND = half(2);

interface Row {
  readonly slug: string;
  readonly name: string;
  readonly unit: { readonly panes: readonly UValuePaneData[]; readonly gaps: readonly UValueGapData[] };
  /** h_s of every gap, 5 decimals; null for single glazing. */
  readonly hs: number | null;
  /** U, 5 decimals. */
  readonly u: number;
  /** U rounded to 0.1. */
  readonly rounded: number;
  /** U with h_e = 25, 5 decimals. */
  readonly u25: number;
  /** Common published rounded value or range; null where none is known. */
  readonly published: readonly [number, number] | null;
}

const rows: readonly Row[] = [
  {
    slug: "single-4",
    name: "single 4 mm",
    unit: { panes: [pane(4)], gaps: [] },
    hs: null,
    u: 5.79783,
    rounded: 5.8,
    u25: 5.91716,
    published: [5.8, 5.8],
  },
  {
    slug: "single-6",
    name: "single 6 mm",
    unit: { panes: [pane(6)], gaps: [] },
    hs: null,
    u: 5.73137,
    rounded: 5.7,
    u25: 5.84795,
    published: [5.7, 5.7],
  },
  {
    slug: "4-12air-4",
    name: "4/12 air/4 uncoated",
    unit: double(12, "air"),
    hs: 5.77954,
    u: 2.86121,
    rounded: 2.9,
    u25: 2.88997,
    published: [2.9, 2.9],
  },
  {
    slug: "4-16air-4",
    name: "4/16 air/4 uncoated",
    unit: double(16, "air"),
    hs: 5.31315,
    u: 2.74205,
    rounded: 2.7,
    u25: 2.76845,
    published: [2.7, 2.7],
  },
  {
    slug: "4-16ar-4",
    name: "4/16 argon/4 uncoated",
    unit: double(16, "argon"),
    hs: 4.85928,
    u: 2.61595,
    rounded: 2.6,
    u25: 2.63997,
    published: [2.6, 2.6],
  },
  {
    slug: "4-16air-4-e0.03",
    name: "4/16 air/4 ε 0.03",
    unit: double(16, "air", 0.03),
    hs: 1.76692,
    u: 1.34692,
    rounded: 1.3,
    u25: 1.35326,
    published: [1.3, 1.4],
  },
  {
    slug: "4-16ar-4-e0.03",
    name: "4/16 Ar 100 %/4 ε 0.03",
    unit: double(16, "argon", 0.03),
    hs: 1.31306,
    u: 1.06603,
    rounded: 1.1,
    u25: 1.07,
    published: [1.0, 1.1],
  },
  {
    slug: "4-16ar-4-e0.04",
    name: "4/16 Ar 100 %/4 ε 0.04",
    unit: double(16, "argon", 0.04),
    hs: 1.36377,
    u: 1.09921,
    rounded: 1.1,
    u25: 1.10343,
    published: [1.1, 1.1],
  },
  {
    slug: "4-16ar90-4-e0.03",
    name: "4/16 Ar 90 %/4 ε 0.03",
    unit: double(16, AR90, 0.03),
    hs: 1.37175,
    u: 1.1044,
    rounded: 1.1,
    u25: 1.10866,
    published: [1.1, 1.1],
  },
  {
    slug: "4-16ar90-4-e0.04",
    name: "4/16 Ar 90 %/4 ε 0.04",
    unit: double(16, AR90, 0.04),
    hs: 1.42246,
    u: 1.13703,
    rounded: 1.1,
    u25: 1.14155,
    published: [1.1, 1.1],
  },
  {
    slug: "4-16ar-4-16ar-4-e0.03",
    name: "4/16Ar/4/16Ar/4 2× ε 0.03",
    unit: triple(16, "argon", 0.03),
    hs: 1.20582,
    u: 0.54374,
    rounded: 0.5,
    u25: 0.54477,
    published: [0.5, 0.6],
  },
  {
    slug: "4-16ar90-4-16ar90-4-e0.03",
    name: "4/16Ar90/4/16Ar90/4 2× ε 0.03",
    unit: triple(16, AR90, 0.03),
    hs: 1.25657,
    u: 0.5643,
    rounded: 0.6,
    u25: 0.56541,
    published: [0.6, 0.6],
  },
  {
    slug: "4-16ar-4-16ar-4-e0.04",
    name: "4/16Ar/4/16Ar/4 2× ε 0.04",
    unit: triple(16, "argon", 0.04),
    hs: 1.25653,
    u: 0.56428,
    rounded: 0.6,
    u25: 0.56539,
    published: [0.6, 0.6],
  },
  {
    slug: "4-12kr-4-12kr-4-e0.03",
    name: "4/12Kr/4/12Kr/4 2× ε 0.03",
    unit: triple(12, "krypton", 0.03),
    hs: 0.90332,
    u: 0.41762,
    rounded: 0.4,
    u25: 0.41822,
    published: null,
  },
];

const rowCases = (row: Row): UValueCase[] => {
  const expected: ExpectedValue[] = [{ quantity: "uValueWPerM2K", unit: "W/(m²K)", value: row.u, tolerance: U_TOL }];
  if (row.hs !== null) expected.push({ quantity: "gap.conductanceWPerM2K", unit: "W/(m²K)", value: row.hs, tolerance: U_TOL });
  expected.push({
    quantity: "uValueRoundedToTenth",
    unit: "W/(m²K)",
    value: row.rounded,
    tolerance: { abs: 5e-11, reason: "a rounded value: equal up to float64 rounding (10 decimals)" },
  });
  const out: UValueCase[] = [
    { id: `u-value/${row.slug}`, label: `${row.name}: U = ${row.u} W/m²K`, input: { kind: "unit", ...row.unit }, expected, source: EN673_ROUNDED },
    {
      id: `u-value/${row.slug}/he25`,
      label: `${row.name}: U = ${row.u25} W/m²K with h_e = 25 (the R_se = 0.04 m²K/W convention of EN ISO 6946)`,
      input: { kind: "unit", ...row.unit, externalCoefficientWPerM2K: 25 },
      expected: [{ quantity: "uValueWPerM2K", unit: "W/(m²K)", value: row.u25, tolerance: U_TOL }],
      source: EN673,
    },
  ];
  if (row.published) {
    const [lo, hi] = row.published;
    out.push({
      id: `u-value/${row.slug}/published-rounded`,
      label: `${row.name}: declared U (to 0.1) within the common published ${lo === hi ? `value ${lo}` : `range ${lo}–${hi}`}`,
      input: { kind: "unit", ...row.unit },
      // the published range [lo, hi] as its midpoint ± half its width (+1e-9 for float64 rounding)
      expected: [
        {
          quantity: "uValueRoundedToTenth",
          unit: "W/(m²K)",
          value: (lo + hi) / 2,
          tolerance: {
            abs: (hi - lo) / 2 + 1e-9,
            reason: `published as ${lo === hi ? `${lo}` : `the range ${lo}–${hi}`}: the range, plus 1e-9 for float64 rounding`,
          },
        },
      ],
      source: COMMON_PUBLISHED,
    });
  }
  return out;
};

export const uValueCases: readonly UValueCase[] = [
  ...rows.flatMap(rowCases),

  // Intermediate values of single steps.
  {
    id: "u-value/4-16air-4/intermediate",
    label: "4/16 air/4 uncoated: h_r, Gr, Pr, Gr·Pr, Nu and h_g of the gap",
    input: { kind: "unit", ...double(16, "air") },
    expected: [
      { quantity: "gap.radiativeConductanceWPerM2K", unit: "W/(m²K)", value: 3.699543, tolerance: HALF_6TH },
      { quantity: "gap.grashof", unit: "-", value: 10424.05, tolerance: HALF_2ND },
      { quantity: "gap.prandtl", unit: "-", value: 0.711173, tolerance: HALF_6TH },
      { quantity: "gap.grashofPrandtl", unit: "-", value: 7413.3, tolerance: HALF_2ND },
      { quantity: "gap.nusselt", unit: "-", value: 1.03436, tolerance: half(5) },
      { quantity: "gap.gasConductanceWPerM2K", unit: "W/(m²K)", value: 1.613605, tolerance: HALF_6TH },
    ],
    source: EN673,
  },
  {
    id: "u-value/4-16ar-4/intermediate",
    label: "argon, 16 mm, ΔT 15 K: Gr, Pr and Nu of the gap",
    input: { kind: "unit", ...double(16, "argon") },
    expected: [
      { quantity: "gap.grashof", unit: "-", value: 13128.23, tolerance: HALF_2ND },
      { quantity: "gap.prandtl", unit: "-", value: 0.666933, tolerance: HALF_6TH },
      { quantity: "gap.nusselt", unit: "-", value: 1.10189, tolerance: half(5) },
    ],
    source: EN673,
  },
  {
    id: "u-value/4-12air-4/conduction-only",
    label: "4/12 air/4: below the onset of convection, Nu = 1 and h_g = λ/s = 0.02496/0.012 = 2.08 W/m²K",
    input: { kind: "unit", ...double(12, "air") },
    expected: [
      { quantity: "gap.nusselt", unit: "-", value: 1, tolerance: { abs: 0, reason: "Nu is set to exactly 1 below the onset" } },
      {
        quantity: "gap.gasConductanceWPerM2K",
        unit: "W/(m²K)",
        value: 2.08,
        tolerance: { abs: 5e-13, reason: "float64 rounding only (12 decimals)" },
      },
    ],
    source: {
      kind: "closed-form",
      formula: "h_g = Nu λ/s with Nu = 1, λ = 0.02496 W/(mK) (air, EN 673:2011 clause 6 table at 10 °C, from memory), s = 12 mm",
      citation: "EN 673:2011 clauses 5–6 (from memory)",
    },
  },
  {
    id: "u-value/4-16ar-4-16ar-4-e0.03/split",
    label: "4/16Ar/4/16Ar/4 2× ε 0.03: ΔT splits 7.5 / 7.5 K and both gaps only conduct (Nu = 1)",
    input: { kind: "unit", ...triple(16, "argon", 0.03) },
    expected: [
      { quantity: "gap.temperatureDifferenceK", unit: "K", value: 7.5, tolerance: { abs: 5e-10, reason: "converged split (9 decimals)" } },
      { quantity: "gap.nusselt", unit: "-", value: 1, tolerance: { abs: 0, reason: "Nu is set to exactly 1 below the onset" } },
    ],
    source: EN673,
  },
  {
    id: "u-value/radiative/0.03-0.837",
    label: "h_r between ε 0.03 and ε 0.837 at T_m 283 K = 0.153318 W/m²K",
    input: { kind: "radiative-conductance", emissivity1: 0.03, emissivity2: 0.837 },
    expected: [{ quantity: "radiativeConductanceWPerM2K", unit: "W/(m²K)", value: 0.153318, tolerance: HALF_6TH }],
    source: EN673,
  },
  {
    id: "u-value/radiative/0.837-0.04",
    label: "h_r between ε 0.837 and ε 0.04 at T_m 283 K = 0.204029 W/m²K",
    input: { kind: "radiative-conductance", emissivity1: 0.837, emissivity2: 0.04 },
    expected: [{ quantity: "radiativeConductanceWPerM2K", unit: "W/(m²K)", value: 0.204029, tolerance: HALF_6TH }],
    source: EN673,
  },
  {
    id: "u-value/radiative/0.837-0.837",
    label: "h_r between two uncoated faces (ε 0.837) at T_m 283 K = 3.699543 W/m²K",
    input: { kind: "radiative-conductance", emissivity1: 0.837, emissivity2: 0.837 },
    expected: [{ quantity: "radiativeConductanceWPerM2K", unit: "W/(m²K)", value: 3.699543, tolerance: HALF_6TH }],
    source: EN673,
  },
  {
    id: "u-value/internal/0.837",
    label: "h_i for an uncoated room-side face: 3.6 + 4.4 = 8.0 W/m²K",
    input: { kind: "internal-coefficient", roomSideEmissivity: 0.837 },
    expected: [
      {
        quantity: "internalCoefficientWPerM2K",
        unit: "W/(m²K)",
        value: 8.0,
        tolerance: { abs: 5e-13, reason: "float64 rounding only (12 decimals)" },
      },
    ],
    source: { kind: "closed-form", formula: "h_i = 3.6 + 4.4 ε_i/0.837 with ε_i = 0.837", citation: "EN 673:2011 clause 7 (from memory)" },
  },
  {
    id: "u-value/internal/0.2",
    label: "h_i for a room-side low-e face ε 0.2 = 4.65 W/m²K",
    input: { kind: "internal-coefficient", roomSideEmissivity: 0.2 },
    expected: [{ quantity: "internalCoefficientWPerM2K", unit: "W/(m²K)", value: 4.65, tolerance: HALF_2ND }],
    source: EN673,
  },
  {
    id: "u-value/internal/0.1",
    label: "h_i for a room-side low-e face ε 0.1 = 4.13 W/m²K",
    input: { kind: "internal-coefficient", roomSideEmissivity: 0.1 },
    expected: [{ quantity: "internalCoefficientWPerM2K", unit: "W/(m²K)", value: 4.13, tolerance: HALF_2ND }],
    source: EN673,
  },

  // Onset of convection: Nu reaches 1 at Gr·Pr = 0.035^(−1/0.38) = 6782.66 (vertical, ΔT 15 K, T_m 283 K).
  ...(
    [
      ["air", 15.53],
      ["argon", 14.69],
      ["krypton", 9.68],
    ] as const
  ).map(([gas, mm]): UValueCase => ({
    id: `u-value/onset/${gas}`,
    label: `${gas}: convection starts at a gap of ${mm} mm (ΔT 15 K)`,
    input: { kind: "convection-onset", gas },
    expected: [{ quantity: "convectionOnsetWidthMm", unit: "mm", value: mm, tolerance: { abs: 0.005, reason: "printed to 0.01 mm" } }],
    source: EN673,
  })),
  {
    id: "u-value/onset/threshold",
    label: "vertical glazing: Nu = 0.035 (Gr·Pr)^0.38 reaches 1 at Gr·Pr = 6782.66",
    input: { kind: "nusselt", grashofPrandtl: 6782.66, tiltDeg: 90 },
    expected: [{ quantity: "nusselt", unit: "-", value: 1, tolerance: { abs: 5e-6, reason: "Gr·Pr printed to 2 decimals (5 decimals in Nu)" } }],
    source: EN673,
  },

  // Tilt: the tabulated convection constants and their effect.
  ...(
    [
      [90, 0.035, 0.38],
      [45, 0.1, 0.31],
      [0, 0.16, 0.28],
    ] as const
  ).map(([tiltDeg, a, n]): UValueCase => ({
    id: `u-value/convection-constants/${tiltDeg}deg`,
    label: `convection constants at ${tiltDeg}°: A = ${a}, n = ${n}`,
    input: { kind: "convection-constants", tiltDeg },
    expected: [
      { quantity: "tabulatedTiltDeg", unit: "°", value: tiltDeg, tolerance: { abs: 0, reason: "a tabulated tilt: exact" } },
      { quantity: "a", unit: "-", value: a, tolerance: { abs: 0, reason: "stored as printed: exact" } },
      { quantity: "n", unit: "-", value: n, tolerance: { abs: 0, reason: "stored as printed: exact" } },
    ],
    source: {
      kind: "published",
      citation: "EN 673:2011 clause 5, constants A and n of Nu = A (Gr·Pr)^n for vertical, 45° and horizontal glazing (values from memory)",
      fromMemory: true,
    },
  })),
  {
    id: "u-value/4-16air-4/tilt-45deg",
    label: "4/16 air/4 at 45°: Nu = 0.10 · 7413.30^0.31 (Gr·Pr does not depend on tilt)",
    input: { kind: "unit", ...double(16, "air"), tiltDeg: 45 },
    // = 0.10 · 7413.30^0.31
    expected: [
      {
        quantity: "gap.nusselt",
        unit: "-",
        value: 1.583811851349925,
        tolerance: { abs: 1e-6, reason: "the printed Gr·Pr carries ±0.005 (relative 7e-7) → ~3e-7 relative in Nu" },
      },
    ],
    source: {
      kind: "closed-form",
      formula: "Nu = A (Gr·Pr)^n with A 0.10, n 0.31 (45°) and Gr·Pr = 7413.30 of the vertical 4/16 air/4 gap",
      citation: "EN 673:2011 clause 5 (constants from memory)",
    },
  },
  {
    id: "u-value/4-16air-4/tilt-0deg",
    label: "4/16 air/4 horizontal: Nu = 0.16 · 7413.30^0.28 (Gr·Pr does not depend on tilt)",
    input: { kind: "unit", ...double(16, "air"), tiltDeg: 0 },
    // = 0.16 · 7413.30^0.28
    expected: [
      {
        quantity: "gap.nusselt",
        unit: "-",
        value: 1.9396493435124083,
        tolerance: { abs: 1e-6, reason: "the printed Gr·Pr carries ±0.005 (relative 7e-7) → ~3e-7 relative in Nu" },
      },
    ],
    source: {
      kind: "closed-form",
      formula: "Nu = A (Gr·Pr)^n with A 0.16, n 0.28 (horizontal) and Gr·Pr = 7413.30 of the vertical 4/16 air/4 gap",
      citation: "EN 673:2011 clause 5 (constants from memory)",
    },
  },
];

export const uValueDomain: ReferenceDomain<UValueCaseInput> = {
  domain: "u-value",
  title: "Centre-of-glass U value (EN 673:2011, declared conditions)",
  cases: uValueCases,
};
