/**
 * Panes known by measured normal-incidence values: what the rest of the app uses.
 * - measured-values.ts: the values, their checks and MeasuredPaneError
 * - uncoated-inversion.ts: uncoated pane → equivalent slab (n, α)
 * - coated-angular-estimate.ts: coated pane → Karlsson–Roos transmittance, reference-curve reflectance
 * - measured-band-model.ts: classification, preparation per band, evaluation at an angle
 */
export { MeasuredPaneError, type MeasuredPaneErrorReason, type MeasuredPaneSpec, type MeasuredValues } from "./measured-values";
export { invertUncoatedPane, PLAUSIBLE_GLASS_INDEX_RANGE, type UncoatedInversion } from "./uncoated-inversion";
export {
  KARLSSON_ROOS_LAYER_DEFAULT,
  karlssonRoosTransmittanceRatio,
  REFERENCE_PANE_REFRACTIVE_INDEX,
  referenceCurveReflectance,
  referenceInternalTransmittance,
} from "./coated-angular-estimate";
export {
  measuredBandAt,
  measuredBandAtUnchecked,
  prepareMeasuredPane,
  UNCOATED_FACE_TOLERANCE,
  type MeasuredBandModel,
  type MeasuredPane,
  type MeasuredPaneOptions,
} from "./measured-band-model";
