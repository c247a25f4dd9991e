/**
 * Reference cases: reflection and refraction at one planar interface (Fresnel equations, Snell's law).
 *
 * Every expected value is computed independently, in float64, from the Fresnel equations by
 * scripts/reference/fresnel.ts, with the sign convention r_p(0) = r_s(0) = (n1 − n2)/(n1 + n2).
 * Values are printed to about 6 digits; each tolerance is half a unit in the last printed digit.
 */
import { ev, half } from "./build";
import type { CaseSource, ReferenceCase, ReferenceDomain } from "./types";

/** One interface: incident medium n1 (real), transmitting medium n2 (real), angle of incidence in degrees. */
export type FresnelCaseInput =
  | { readonly kind: "interface"; readonly n1: number; readonly n2: number; readonly thetaDeg: number }
  /** Brewster's angle atan(n2/n1), and the reflectances there. */
  | { readonly kind: "brewster"; readonly n1: number; readonly n2: number }
  /** Critical angle asin(n2/n1) for n1 > n2. */
  | { readonly kind: "critical"; readonly n1: number; readonly n2: number }
  /**
   * Reciprocity: refract from n1 into n2 at thetaDeg, then reflect from n2 back towards n1 at the refracted angle.
   * Quantities: thetaTDeg (the refracted angle), RsBack, RpBack.
   */
  | { readonly kind: "reciprocity"; readonly n1: number; readonly n2: number; readonly thetaDeg: number }
  /** An absorbing transmitting medium of complex index N = n + ik (closed-form cases only). */
  | {
      readonly kind: "absorbing-interface";
      readonly n1: number;
      readonly n2: { readonly re: number; readonly im: number };
      readonly thetaDeg: number;
    };

export const FRESNEL_SCRIPT = "scripts/reference/fresnel.ts";

const computed: CaseSource = {
  kind: "computed",
  formula:
    "Fresnel equations and Snell's law, E. Hecht, Optics, 4th ed., Addison-Wesley 2002, §4.6; M. Born & E. Wolf, " +
    "Principles of Optics, 7th ed., Cambridge University Press 1999, §1.5 (sections from memory); " +
    "sign convention r_p(0) = r_s(0)",
  script: FRESNEL_SCRIPT,
  fromMemory: true,
};

const P6 = half(6);
const P4 = half(4);

/** Air → glass: θ [deg], n2, R_s, R_p, R, θt [deg] (θt printed as "0" at normal incidence). */
const airGlassRows: readonly [number, number, number, number, number, number][] = [
  [0, 1.5, 0.04, 0.04, 0.04, 0],
  [30, 1.5, 0.057796, 0.025249, 0.041523, 19.4712],
  [45, 1.5, 0.092013, 0.008466, 0.05024, 28.1255],
  [60, 1.5, 0.176571, 0.001802, 0.089187, 35.2644],
  [75, 1.5, 0.399356, 0.106765, 0.253061, 40.087],
  [85, 1.5, 0.732345, 0.493254, 0.6128, 41.6156],
  [0, 1.52, 0.04258, 0.04258, 0.04258, 0],
  [30, 1.52, 0.061209, 0.027078, 0.044144, 19.2049],
  [45, 1.52, 0.096733, 0.009357, 0.053045, 27.7233],
  [60, 1.52, 0.183438, 0.001527, 0.092483, 34.733],
  [75, 1.52, 0.407851, 0.10558, 0.256715, 39.4554],
  [85, 1.52, 0.737674, 0.492173, 0.614923, 40.9493],
];

export const airGlassCases: readonly ReferenceCase<FresnelCaseInput>[] = airGlassRows.map(([theta, n2, Rs, Rp, R, thetaT]) => ({
  id: `fresnel/air-glass-${n2}/${theta}deg`,
  label: `air → glass n = ${n2} at ${theta}°: R_s, R_p, R and the refraction angle`,
  input: { kind: "interface", n1: 1, n2, thetaDeg: theta },
  expected: [ev("Rs", Rs, P6), ev("Rp", Rp, P6), ev("R", R, P6), ev("thetaTDeg", thetaT, theta === 0 ? half(0) : P4, "deg")],
  source: computed,
}));

export const signConventionCases: readonly ReferenceCase<FresnelCaseInput>[] = [
  {
    id: "fresnel/sign/air-glass-1.52/30deg",
    label: "amplitudes 1 → 1.52 at 30°: r_s and r_p both negative below Brewster's angle",
    input: { kind: "interface", n1: 1, n2: 1.52, thetaDeg: 30 },
    expected: [ev("rs.re", -0.247404, P6), ev("rp.re", -0.164555, P6)],
    source: computed,
  },
  {
    id: "fresnel/sign/air-glass-1.52/60deg",
    label: "amplitudes 1 → 1.52 at 60°: r_p has changed sign above Brewster's angle",
    input: { kind: "interface", n1: 1, n2: 1.52, thetaDeg: 60 },
    expected: [ev("rs.re", -0.428297, P6), ev("rp.re", 0.039079, P6)],
    source: computed,
  },
];

export const brewsterCases: readonly ReferenceCase<FresnelCaseInput>[] = [
  [1.5, 56.3099, 0.147929],
  [1.52, 56.6593, 0.156692],
].map(([n2, thetaB, Rs]) => ({
  id: `fresnel/brewster/air-glass-${n2}`,
  label: `Brewster's angle atan(${n2}) and R_s there (R_p = 0)`,
  input: { kind: "brewster", n1: 1, n2: n2! },
  expected: [ev("brewsterAngleDeg", thetaB!, P4, "deg"), ev("Rs", Rs!, P6)],
  source: computed,
}));

export const criticalCases: readonly ReferenceCase<FresnelCaseInput>[] = [
  [1.5, 41.8103],
  [1.52, 41.1395],
].map(([n1, thetaC]) => ({
  id: `fresnel/critical/glass-${n1}-air`,
  label: `critical angle asin(1/${n1}), glass → air`,
  input: { kind: "critical", n1: n1!, n2: 1 },
  expected: [ev("criticalAngleDeg", thetaC!, P4, "deg")],
  source: computed,
}));

/** Glass → air below the critical angle: R_s, R_p, R and the real q_x = n2 cos θt (n2 = 1). */
export const internalCases: readonly ReferenceCase<FresnelCaseInput>[] = [
  [30, 0.114875, 0.00432, 0.059598, 0.649923],
  [40, 0.476976, 0.164595, 0.320785, 0.213069],
].map(([theta, Rs, Rp, R, cosT]) => ({
  id: `fresnel/internal/glass-1.52-air/${theta}deg`,
  label: `glass 1.52 → air at ${theta}°: R_s, R_p, R and cos θt`,
  input: { kind: "interface", n1: 1.52, n2: 1, thetaDeg: theta! },
  expected: [ev("Rs", Rs!, P6), ev("Rp", Rp!, P6), ev("R", R!, P6), ev("qx.re", cosT!, P6)],
  source: computed,
}));

/** Glass → air beyond the critical angle: cos θt is imaginary (decaying branch, Im ≥ 0). */
export const totalInternalReflectionCases: readonly ReferenceCase<FresnelCaseInput>[] = [
  [45, 0.393954],
  [60, 0.856037],
].map(([theta, cosTim]) => ({
  id: `fresnel/tir/glass-1.52-air/${theta}deg`,
  label: `glass 1.52 → air at ${theta}° (total internal reflection): Im(cos θt)`,
  input: { kind: "interface", n1: 1.52, n2: 1, thetaDeg: theta! },
  expected: [ev("qx.im", cosTim!, P6)],
  source: computed,
}));

export const phaseCases: readonly ReferenceCase<FresnelCaseInput>[] = [
  {
    id: "fresnel/tir/glass-1.52-air/60deg/phases",
    label: "glass 1.52 → air at 60°: phases of r_s and r_p under total internal reflection",
    input: { kind: "interface", n1: 1.52, n2: 1, thetaDeg: 60 },
    expected: [ev("argRsDeg", -96.8, half(2), "deg"), ev("argRpDeg", 42.04, half(2), "deg")],
    source: computed,
  },
];

export const reciprocityCases: readonly ReferenceCase<FresnelCaseInput>[] = [
  {
    id: "fresnel/reciprocity/1.52/30deg",
    label: "glass 1.52 → air at the refraction angle of 30° reflects as air → glass at 30°",
    input: { kind: "reciprocity", n1: 1, n2: 1.52, thetaDeg: 30 },
    expected: [ev("thetaTDeg", 19.2049, P4, "deg"), ev("RsBack", 0.0612087, half(7)), ev("RpBack", 0.0270783, half(7))],
    source: computed,
  },
];

/** Exact to float64 rounding: the closed form evaluated in double precision. */
const ROUNDING = { abs: 1e-15, reason: "exact in closed form; float64 rounding" } as const;
const EXACT = { abs: 0, reason: "exact in closed form and in float64" } as const;
const normalIncidence = (n1: number, n2: number) => (n1 - n2) / (n1 + n2);

/** Closed forms the engine must meet to float64 rounding (not recomputed by the script). */
export const closedFormCases: readonly ReferenceCase<FresnelCaseInput>[] = [
  {
    id: "fresnel/closed-form/normal/air-glass-1.5",
    label: "normal incidence 1 → 1.5: R_s = R_p = ((n − 1)/(n + 1))² = 0.04",
    input: { kind: "interface", n1: 1, n2: 1.5, thetaDeg: 0 },
    expected: [ev("Rs", 0.04, ROUNDING), ev("Rp", 0.04, ROUNDING)],
    source: {
      kind: "closed-form",
      formula: "R = ((n1 − n2)/(n1 + n2))² at normal incidence",
      citation: "E. Hecht, Optics, 4th ed., §4.6 (from memory)",
    },
  },
  ...(
    [
      [1, 1.5],
      [1, 1.52],
      [1.52, 1],
      [1.33, 2.4],
    ] as const
  ).map(([n1, n2]): ReferenceCase<FresnelCaseInput> => ({
    id: `fresnel/closed-form/normal-amplitudes/${n1}-${n2}`,
    label: `normal incidence ${n1} → ${n2}: r_p = r_s = (n1 − n2)/(n1 + n2) = ${normalIncidence(n1, n2).toFixed(6)}, both real`,
    input: { kind: "interface", n1, n2, thetaDeg: 0 },
    expected: [
      ev("rs.re", normalIncidence(n1, n2), ROUNDING),
      ev("rp.re", normalIncidence(n1, n2), ROUNDING),
      ev("rs.im", 0, EXACT),
      ev("rp.im", 0, EXACT),
    ],
    source: { kind: "closed-form", formula: "r_s(0) = r_p(0) = (n1 − n2)/(n1 + n2) with the sign convention r_p(0) = r_s(0)" },
  })),
  {
    id: "fresnel/closed-form/transmission-amplitudes/1.52/45deg",
    label: "1 → 1.52 at 45°: t_s = 2n1 cos θi/(n1 cos θi + n2 cos θt) = 0.688980, t_p = 2n1 cos θi/(n1 cos θt + n2 cos θi) = 0.721535",
    input: { kind: "interface", n1: 1, n2: 1.52, thetaDeg: 45 },
    expected: [
      ev("ts.re", 0.6889804508261655, { abs: 5e-15, reason: "float64 rounding of the closed form (14 decimals)" }),
      ev("tp.re", 0.7215349736633521, { abs: 5e-15, reason: "float64 rounding of the closed form (14 decimals)" }),
    ],
    source: { kind: "closed-form", formula: "t_s and t_p of real indices", citation: "E. Hecht, Optics, 4th ed., §4.6 (from memory)" },
  },
  {
    id: "fresnel/closed-form/grazing/air-glass-1.52",
    label: "grazing incidence 1 → 1.52 (θi = 90°): R = 1 and T = 0 for s and p",
    input: { kind: "interface", n1: 1, n2: 1.52, thetaDeg: 90 },
    expected: [ev("Rs", 1, EXACT), ev("Rp", 1, EXACT), ev("Ts", 0, EXACT), ev("Tp", 0, EXACT)],
    source: { kind: "closed-form", formula: "cos θi = 0: r_s = r_p = −1 in magnitude, no flux enters" },
  },
  {
    id: "fresnel/closed-form/absorbing/0.2+3i/normal",
    label: "normal incidence from air on a metal-like medium N = 0.2 + 3i: R = ((n − 1)² + k²)/((n + 1)² + k²) = 9.64/10.44",
    input: { kind: "absorbing-interface", n1: 1, n2: { re: 0.2, im: 3 }, thetaDeg: 0 },
    expected: [ev("Rs", 9.64 / 10.44, ROUNDING), ev("Rp", 9.64 / 10.44, ROUNDING)],
    source: {
      kind: "closed-form",
      formula: "R = ((n − 1)² + k²)/((n + 1)² + k²) at normal incidence on N = n + ik",
      citation: "M. Born & E. Wolf, Principles of Optics, 7th ed., optics of metals (chapter from memory)",
    },
  },
];

export const fresnelDomain: ReferenceDomain<FresnelCaseInput> = {
  domain: "fresnel",
  title: "Reflection and refraction at one interface (Fresnel equations)",
  cases: [
    ...airGlassCases,
    ...signConventionCases,
    ...brewsterCases,
    ...criticalCases,
    ...internalCases,
    ...totalInternalReflectionCases,
    ...phaseCases,
    ...reciprocityCases,
    ...closedFormCases,
  ],
};
