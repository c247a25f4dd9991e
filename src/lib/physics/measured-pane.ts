/**
 * Panes known by measured normal-incidence values (solar, optionally visible): T, Rf, Rb.
 *
 * (a) Uncoated (|Rf − Rb| ≤ {@link UNCOATED_FACE_TOLERANCE} in every band given): the values
 *     are inverted in closed form to an equivalent refractive index n and absorption
 *     coefficient α of the slab model (absorbing-pane.ts), which then gives T, R and A per
 *     polarisation at any angle. From band-weighted data n and α are "effective" values, useful
 *     to scale that pane to other angles, not material constants.
 * (b) Coated (Rf ≠ Rb beyond the tolerance in some band): optical constants are unknown, so the
 *     angular dependence is estimated:
 *     - T(θ) = T(0) · KR(θ), the Karlsson & Roos (2000) polynomial, applied per layer with p = 1
 *       and q = 4 by default (see {@link karlssonRoosTransmittanceRatio});
 *     - each face's reflectance follows a normalised reference curve (common practice, no
 *       source): R_c(θ) = R_c(0) + (1 − R_c(0)) · [R_ref(θ) − R_ref(0)] / [1 − R_ref(0)], where
 *       "ref" is an uncoated slab of the same thickness with n = 1.52 and α chosen so that
 *       T_ref(0) = T_c(0) (α = 0 when T_c(0) exceeds the lossless slab's 2n/(n² + 1));
 *     - A ≥ 0 is enforced per face by R ≤ 1 − T;
 *     - the visible band uses the same curves; the Karlsson–Roos fit was made for total solar
 *       energy transmittance, so applying it to light transmittance is our extension.
 *     Coated layers have no s/p split: they return the same values for s and p, so the stack's
 *     per-polarisation route treats them as unpolarised. Expect errors of several percentage
 *     points beyond 60°; results are estimates.
 *
 * @see R. A. Furler, "Angular dependence of optical properties of homogeneous glasses",
 *   ASHRAE Transactions 98(1), 1992 (LBL-31727): angular scaling of homogeneous glass from
 *   normal-incidence data through equivalent optical constants
 * @see J. Karlsson & A. Roos, "Modelling the angular behaviour of the total solar energy
 *   transmittance of windows", Solar Energy 69(4):321–329, 2000 (from memory)
 */
import { fresnelReflectancesReal } from "./fresnel";
import {
  absorbingPaneOpticsUnchecked,
  checkAbsorbingPane,
  slabFromFaceReflectance,
  type AbsorbingPaneSpec,
} from "./absorbing-pane";
import type { LayerOptics, PolarizedLayerOptics } from "./layer-stack";
import { checkIncidenceAngleRad, GRAZING_INCIDENCE_RAD, type Radians } from "./units";

/** Measured normal-incidence values of one band [-]; f = the face towards outdoors. */
export interface MeasuredValues {
  readonly T: number;
  readonly Rf: number;
  readonly Rb: number;
}

/** A pane described by measured values, as entered. */
export interface MeasuredPaneSpec {
  /** pane thickness [m] */
  readonly thicknessM: number;
  /** solar (broadband solar-weighted) values */
  readonly solar: MeasuredValues;
  /** visible (light-weighted) values, optional */
  readonly visible?: MeasuredValues;
}

/**
 * Largest |Rf − Rb| treated as uncoated [-]: 0.005, i.e. half a percentage point. Common
 * practice (no source): the two faces of uncoated float glass differ only by measurement
 * repeatability, well below this; a coating separates them by more.
 */
export const UNCOATED_FACE_TOLERANCE = 0.005;

/** Refractive index of the uncoated reference pane used for coated reflectance curves [-]. */
export const REFERENCE_PANE_REFRACTIVE_INDEX = 1.52;

/** Karlsson–Roos parameters used per coated layer: p = 1 (one layer), q = 4 (see {@link karlssonRoosTransmittanceRatio}). */
export const KARLSSON_ROOS_LAYER_DEFAULT = Object.freeze({ p: 1, q: 4 });

/** Range of refractive index usual for window glass [-] (common practice, no source); outside it a warning is due. */
export const PLAUSIBLE_GLASS_INDEX_RANGE = Object.freeze({ min: 1.45, max: 1.65 });

/** Why a measured pane was refused. */
export type MeasuredPaneErrorReason =
  | "not-a-fraction"
  | "energy-balance"
  | "no-transmittance"
  | "no-reflectance"
  | "negative-discriminant"
  | "face-reflectance"
  | "internal-transmittance"
  | "refractive-index"
  | "thickness";

/** Measured values that cannot describe a pane; `quantity` names the offending value (e.g. "solar.T"). */
export class MeasuredPaneError extends RangeError {
  override readonly name = "MeasuredPaneError";
  constructor(
    readonly quantity: string,
    readonly reason: MeasuredPaneErrorReason,
    message: string,
  ) {
    super(`${quantity}: ${message}`);
  }
}

/** Result of the normal-incidence inversion of an uncoated pane. */
export interface UncoatedInversion {
  /** b = 1 + 2R − R² + T² [-] */
  readonly b: number;
  /** single-face reflectance r [-] */
  readonly faceReflectance: number;
  /** one-pass internal transmittance τ [-] */
  readonly internalTransmittance: number;
  /** equivalent refractive index n [-] */
  readonly refractiveIndex: number;
  /** equivalent absorption coefficient α [1/m] */
  readonly absorptionPerM: number;
}

/**
 * Inverts the slab model at normal incidence. With r the single-face reflectance and τ the
 * internal transmittance, R = r(1 + Tτ) and T = (1 − r)²τ/(1 − r²τ²); eliminating τ:
 *   b = 1 + 2R − R² + T²
 *   r = [b − sqrt(b² − 4R(2 − R))] / [2(2 − R)]  (smaller root; evaluated as 2R / (b + sqrt(…)))
 *   τ = (R − r) / (r T),   n = (1 + √r)/(1 − √r)  (from air),   α = −ln(τ)/d
 * Exact for the slab model; a slab computed at 0° inverts back to its n and α to ~1e-12.
 * For T, R in [0, 1] with T > 0, R > 0 and T + R ≤ 1 the discriminant is ≥ (1 − R)⁴, r lies in
 * (0, R) and τ in (0, 1]; those three checks are kept as guards against rounding.
 * @param T measured normal transmittance [-]
 * @param R measured normal reflectance [-] (same both faces)
 * @param thicknessM pane thickness d [m]
 * @param band name used in error messages, e.g. "solar"
 * @returns b, r, τ, n [-] and α [1/m]
 * @throws MeasuredPaneError naming the quantity when T + R > 1, T ≤ 0, R ≤ 0, the discriminant
 *   is negative, r ∉ (0, R), τ ∉ (0, 1] or n is outside the accepted range
 * @see Duffie & Beckman, 4th ed., ch. 5 (slab series; from memory); Furler, ASHRAE Trans. 98(1), 1992
 */
export function invertUncoatedPane(T: number, R: number, thicknessM: number, band = "solar"): UncoatedInversion {
  checkThickness(thicknessM);
  checkFraction(T, `${band}.T`);
  checkFraction(R, `${band}.R`);
  if (T + R > 1) {
    throw new MeasuredPaneError(`${band}.T + ${band}.R`, "energy-balance", `T + R must not exceed 1; got ${T + R}`);
  }
  if (T <= 0) {
    throw new MeasuredPaneError(`${band}.T`, "no-transmittance", "an uncoated pane needs T > 0 for the inversion");
  }
  if (R <= 0) {
    throw new MeasuredPaneError(`${band}.R`, "no-reflectance", "an uncoated pane in air reflects light: R must be > 0");
  }
  const b = 1 + 2 * R - R * R + T * T;
  const disc = b * b - 4 * R * (2 - R);
  if (disc < 0) {
    throw new MeasuredPaneError(
      `${band}.T, ${band}.R`,
      "negative-discriminant",
      `no uncoated slab has these values (discriminant ${disc} < 0)`,
    );
  }
  const r = (2 * R) / (b + Math.sqrt(disc));
  if (!(r > 0 && r < R)) {
    throw new MeasuredPaneError(
      `${band}.R`,
      "face-reflectance",
      `single-face reflectance ${r} must lie in (0, R = ${R})`,
    );
  }
  let tau = (R - r) / (r * T);
  if (tau > 1 && tau <= 1 + 1e-9) tau = 1; // rounding when T + R = 1 (no absorption)
  if (!(tau > 0 && tau <= 1)) {
    throw new MeasuredPaneError(
      `${band}.T, ${band}.R`,
      "internal-transmittance",
      `internal transmittance ${tau} must lie in (0, 1]`,
    );
  }
  const sr = Math.sqrt(r);
  const n = (1 + sr) / (1 - sr);
  const alpha = tau === 1 ? 0 : -Math.log(tau) / thicknessM;
  try {
    checkAbsorbingPane({ thicknessM, refractiveIndex: n, absorptionPerM: alpha });
  } catch (e) {
    throw new MeasuredPaneError(
      `${band}.R`,
      "refractive-index",
      `equivalent refractive index ${n} is outside the accepted range (${(e as Error).message})`,
    );
  }
  return { b, faceReflectance: r, internalTransmittance: tau, refractiveIndex: n, absorptionPerM: alpha };
}

/**
 * Karlsson & Roos angular model for the total solar energy transmittance of glazing:
 *   z = θ / (π/2),  T(θ)/T(0) = 1 − a z^α − b z^β − c z^γ
 *   a = 8,  b = 0.25/q,  c = 1 − a − b,  α = 5.2 + 0.7q,  β = 2,  γ = (5.26 + 0.06p) + (0.73 + 0.04p)q
 * p: number of panes; q: glazing-type index (meanings as recalled, from memory, pending
 * verification against the paper's table). Coefficients are cited from memory, pending
 * verification. Here the model is applied per coated layer with p = 1 (one layer) and q = 4
 * by default (a mid-range glazing-type index; our choice, no source); with these values it
 * stays within 0.011 of an uncoated 6 mm n = 1.52 slab's own T(θ)/T(0) up to 80°. Accepted ranges (our guard, chosen so that the curve stays in [0, 1] and falls
 * monotonically): p ∈ {1, 2, 3}, q ∈ [1, 10]; the result is clamped to [0, 1].
 * @param thetaRad angle of incidence [rad], in [0, π/2]
 * @param p number of panes, 1..3
 * @param q glazing-type index, 1..10
 * @returns T(θ)/T(0) [-], 1 at θ = 0 and 0 at θ = π/2
 * @see J. Karlsson & A. Roos, Solar Energy 69(4):321–329, 2000 (from memory);
 *   J. Karlsson, M. Rubin & A. Roos, Solar Energy 71(1):23–31, 2001 (from memory)
 */
export function karlssonRoosTransmittanceRatio(thetaRad: Radians, p: number, q: number): number {
  checkIncidenceAngleRad(thetaRad);
  checkKarlssonRoos(p, q);
  return karlssonRoosUnchecked(thetaRad, p, q);
}

function checkKarlssonRoos(p: number, q: number): void {
  if (!(p === 1 || p === 2 || p === 3)) {
    throw new RangeError(`Karlsson–Roos pane count p must be 1, 2 or 3; got ${p}`);
  }
  if (!(Number.isFinite(q) && q >= 1 && q <= 10)) {
    throw new RangeError(`Karlsson–Roos glazing-type index q must be in [1, 10]; got ${q}`);
  }
}

function karlssonRoosUnchecked(thetaRad: number, p: number, q: number): number {
  const z = thetaRad / GRAZING_INCIDENCE_RAD;
  const a = 8;
  const b = 0.25 / q;
  const c = 1 - a - b;
  const alpha = 5.2 + 0.7 * q;
  const gamma = 5.26 + 0.06 * p + (0.73 + 0.04 * p) * q;
  const lnz = Math.log(z); // −∞ at z = 0, where exp(−∞) = 0 gives z^α = z^γ = 0 (α, γ > 0)
  const v = 1 - a * Math.exp(alpha * lnz) - b * z * z - c * Math.exp(gamma * lnz);
  return v < 0 ? 0 : v > 1 ? 1 : v;
}

/**
 * Normalised reference-curve rule for the reflectance of one coated face (common practice, no source):
 *   R_c(θ) = R_c(0) + (1 − R_c(0)) · [R_ref(θ) − R_ref(0)] / [1 − R_ref(0)]
 * clamped to [0, 1].
 * @param coatedNormal R_c(0) [-]
 * @param referenceAtAngle R_ref(θ) [-] of an uncoated reference pane
 * @param referenceNormal R_ref(0) [-], < 1
 * @returns R_c(θ) [-]
 */
export function referenceCurveReflectance(
  coatedNormal: number,
  referenceAtAngle: number,
  referenceNormal: number,
): number {
  checkFraction(coatedNormal, "coated reflectance");
  checkFraction(referenceAtAngle, "reference reflectance");
  if (!(referenceNormal >= 0 && referenceNormal < 1)) {
    throw new RangeError(`reference normal reflectance must be in [0, 1); got ${referenceNormal}`);
  }
  return referenceCurveUnchecked(coatedNormal, referenceAtAngle, referenceNormal);
}

function referenceCurveUnchecked(c0: number, rTheta: number, r0: number): number {
  const v = c0 + ((1 - c0) * (rTheta - r0)) / (1 - r0);
  return v < 0 ? 0 : v > 1 ? 1 : v;
}

/**
 * Internal transmittance τ of the reference slab (index n) that transmits T at normal incidence:
 * the root of T r² τ² + (1 − r)² τ − T = 0 with r = ((n − 1)/(n + 1))², written as
 *   τ = 2T / [(1 − r)² + sqrt((1 − r)⁴ + 4 T² r²)],  clamped to ≤ 1.
 * @param T normal transmittance [-], in [0, 1]
 * @param n refractive index [-]
 * @returns τ [-], in [0, 1]
 * @see Duffie & Beckman, 4th ed., ch. 5 (slab series; from memory)
 */
export function referenceInternalTransmittance(T: number, n: number = REFERENCE_PANE_REFRACTIVE_INDEX): number {
  checkFraction(T, "transmittance");
  const r = ((n - 1) / (n + 1)) ** 2;
  const u = (1 - r) * (1 - r);
  const tau = (2 * T) / (u + Math.sqrt(u * u + 4 * T * T * r * r));
  return Math.min(1, tau);
}

/** Model of one band of a measured pane, prepared once. */
export type MeasuredBandModel =
  | {
      readonly kind: "uncoated";
      readonly normal: MeasuredValues;
      /** inversion of T and (Rf + Rb)/2 */
      readonly inversion: UncoatedInversion;
      /** the equivalent slab */
      readonly pane: AbsorbingPaneSpec;
    }
  | {
      readonly kind: "coated";
      readonly normal: MeasuredValues;
      readonly karlssonRoos: { readonly p: number; readonly q: number };
      /**
       * the uncoated reference: index n [-], normal internal transmittance τ0 [-], normal optical
       * depth −ln τ0 = αd [-] (∞ when τ0 = 0), normal reflectance [-]
       */
      readonly reference: {
        readonly refractiveIndex: number;
        readonly internalTransmittanceNormal: number;
        readonly opticalDepthNormal: number;
        readonly reflectanceNormal: number;
      };
    };

/** A measured pane, prepared: one model per band. */
export interface MeasuredPane {
  readonly thicknessM: number;
  /** true when some band has |Rf − Rb| > {@link UNCOATED_FACE_TOLERANCE} */
  readonly coated: boolean;
  readonly solar: MeasuredBandModel;
  readonly visible: MeasuredBandModel | null;
}

/** Options of {@link prepareMeasuredPane}. */
export interface MeasuredPaneOptions {
  /** Karlsson–Roos glazing-type index q for coated layers, default 4 */
  readonly karlssonRoosQ?: number;
}

/**
 * Prepares a measured pane: checks the values, classifies it as uncoated or coated, and
 * inverts (uncoated) or sets up the reference pane (coated) for each band. See the module
 * comment for the models.
 * @param spec thickness [m] and measured normal-incidence values [-]
 * @param options Karlsson–Roos q for coated layers
 * @returns the prepared pane
 * @throws MeasuredPaneError naming the quantity for values that cannot describe a pane
 */
export function prepareMeasuredPane(spec: MeasuredPaneSpec, options: MeasuredPaneOptions = {}): MeasuredPane {
  checkThickness(spec.thicknessM);
  const q = options.karlssonRoosQ ?? KARLSSON_ROOS_LAYER_DEFAULT.q;
  checkKarlssonRoos(KARLSSON_ROOS_LAYER_DEFAULT.p, q);
  const bands: [string, MeasuredValues][] = [["solar", spec.solar]];
  if (spec.visible) bands.push(["visible", spec.visible]);
  for (const [band, v] of bands) checkMeasuredValues(v, band);
  // 1e-12 absorbs float rounding, e.g. 0.0775 − 0.0725 = 0.0050000000000000044
  const coated = bands.some(([, v]) => Math.abs(v.Rf - v.Rb) > UNCOATED_FACE_TOLERANCE + 1e-12);
  const model = (band: string, v: MeasuredValues): MeasuredBandModel => {
    const normal = Object.freeze({ T: v.T, Rf: v.Rf, Rb: v.Rb });
    if (!coated) {
      const inversion = invertUncoatedPane(v.T, 0.5 * (v.Rf + v.Rb), spec.thicknessM, band);
      const pane = checkAbsorbingPane({
        thicknessM: spec.thicknessM,
        refractiveIndex: inversion.refractiveIndex,
        absorptionPerM: inversion.absorptionPerM,
      });
      return { kind: "uncoated", normal, inversion, pane };
    }
    const n = REFERENCE_PANE_REFRACTIVE_INDEX;
    const tau0 = referenceInternalTransmittance(v.T, n);
    const r = ((n - 1) / (n + 1)) ** 2;
    return {
      kind: "coated",
      normal,
      karlssonRoos: { p: KARLSSON_ROOS_LAYER_DEFAULT.p, q },
      reference: {
        refractiveIndex: n,
        internalTransmittanceNormal: tau0,
        opticalDepthNormal: -Math.log(tau0),
        reflectanceNormal: slabFromFaceReflectance(r, tau0).R,
      },
    };
  };
  return {
    thicknessM: spec.thicknessM,
    coated,
    solar: model("solar", spec.solar),
    visible: spec.visible ? model("visible", spec.visible) : null,
  };
}

/**
 * Layer optics of one band of a measured pane at an angle of incidence in air.
 * Uncoated: slab model with the equivalent n and α, per polarisation (Rf = Rb).
 * Coated: T = T(0)·KR(θ; p, q); R_face = reference-curve rule per face with R ≤ 1 − T;
 * identical s and p values.
 * @param model a band model from {@link prepareMeasuredPane}
 * @param thetaRad angle of incidence in air [rad], in [0, π/2]
 * @returns T, Rf, Rb for s and p [-]
 * @see module comment for sources
 */
export function measuredBandAt(model: MeasuredBandModel, thetaRad: Radians): PolarizedLayerOptics {
  checkIncidenceAngleRad(thetaRad);
  return measuredBandAtUnchecked(model, thetaRad);
}

/**
 * {@link measuredBandAt} without the angle check, for callers that checked it.
 * @param model band model; @param thetaRad angle of incidence [rad], in [0, π/2]
 */
export function measuredBandAtUnchecked(model: MeasuredBandModel, thetaRad: Radians): PolarizedLayerOptics {
  if (model.kind === "uncoated") {
    const o = absorbingPaneOpticsUnchecked(model.pane, thetaRad);
    return {
      s: { T: o.s.T, Rf: o.s.R, Rb: o.s.R },
      p: { T: o.p.T, Rf: o.p.R, Rb: o.p.R },
    };
  }
  const { normal, karlssonRoos, reference } = model;
  const T = normal.T * karlssonRoosUnchecked(thetaRad, karlssonRoos.p, karlssonRoos.q);
  const refR = referenceReflectanceAt(reference.refractiveIndex, reference.opticalDepthNormal, thetaRad);
  const maxR = 1 - T;
  const Rf = Math.min(maxR, referenceCurveUnchecked(normal.Rf, refR, reference.reflectanceNormal));
  const Rb = Math.min(maxR, referenceCurveUnchecked(normal.Rb, refR, reference.reflectanceNormal));
  const layer: LayerOptics = { T, Rf, Rb };
  return { s: layer, p: layer };
}

/** Unpolarised reflectance of the reference slab at θ, with τ(θ) = exp(−αd / cos θt). */
function referenceReflectanceAt(n: number, opticalDepthNormal: number, thetaRad: Radians): number {
  const face = fresnelReflectancesReal(1, n, thetaRad);
  const tau = opticalDepthNormal === 0 ? 1 : Math.exp(-opticalDepthNormal / face.cosThetaT); // αd = ∞ → 0
  const s = slabFromFaceReflectance(face.Rs, tau);
  const p = slabFromFaceReflectance(face.Rp, tau);
  return 0.5 * (s.R + p.R);
}

function checkThickness(thicknessM: number): void {
  if (!Number.isFinite(thicknessM) || thicknessM <= 0 || thicknessM > 1) {
    throw new MeasuredPaneError("thicknessM", "thickness", `pane thickness must be finite, in (0, 1] m; got ${thicknessM}`);
  }
}

function checkFraction(v: number, quantity: string): void {
  if (!(v >= 0 && v <= 1)) {
    throw new MeasuredPaneError(quantity, "not-a-fraction", `must be a finite fraction in [0, 1]; got ${v}`);
  }
}

function checkMeasuredValues(v: MeasuredValues, band: string): void {
  checkFraction(v.T, `${band}.T`);
  checkFraction(v.Rf, `${band}.Rf`);
  checkFraction(v.Rb, `${band}.Rb`);
  if (v.T + v.Rf > 1) {
    throw new MeasuredPaneError(`${band}.T + ${band}.Rf`, "energy-balance", `T + Rf must not exceed 1; got ${v.T + v.Rf}`);
  }
  if (v.T + v.Rb > 1) {
    throw new MeasuredPaneError(`${band}.T + ${band}.Rb`, "energy-balance", `T + Rb must not exceed 1; got ${v.T + v.Rb}`);
  }
}
