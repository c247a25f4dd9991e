/**
 * Panes known by measured normal-incidence values (solar, optionally visible): classified as
 * uncoated (|Rf − Rb| ≤ UNCOATED_FACE_TOLERANCE in every band given; inverted to an equivalent
 * slab, uncoated-inversion.ts) or coated (estimated angular model, coated-angular-estimate.ts),
 * prepared once per band and evaluated at any angle of incidence.
 */
import { absorbingPaneOpticsUnchecked, checkAbsorbingPane, slabFromFaceReflectance, type AbsorbingPaneSpec } from "../absorbing-pane";
import type { LayerOptics, PolarizedLayerOptics } from "../layer-stack";
import { checkIncidenceAngleRad, type Radians } from "../units";
import {
  checkKarlssonRoos,
  KARLSSON_ROOS_LAYER_DEFAULT,
  karlssonRoosUnchecked,
  REFERENCE_PANE_REFRACTIVE_INDEX,
  referenceCurveUnchecked,
  referenceInternalTransmittance,
  referenceReflectanceAt,
} from "./coated-angular-estimate";
import { checkMeasuredValues, checkThickness, type MeasuredPaneSpec, type MeasuredValues } from "./measured-values";
import { invertUncoatedPane, type UncoatedInversion } from "./uncoated-inversion";

/**
 * Largest |Rf − Rb| treated as uncoated [-]: 0.005, i.e. half a percentage point. Common
 * practice (no source): the two faces of uncoated float glass differ only by measurement
 * repeatability, well below this; a coating separates them by more.
 */
export const UNCOATED_FACE_TOLERANCE = 0.005;

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
 * @see uncoated-inversion.ts and coated-angular-estimate.ts for the models and their sources
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
