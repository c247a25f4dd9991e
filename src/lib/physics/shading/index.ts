/**
 * External shading of a window by an overhang, side fins and a horizon obstruction: what the
 * rest of the app uses (device specs, prepared shading, scalar forms for infinite devices).
 */
export { DEFAULT_DIFFUSE_QUADRATURE_POINTS, type DiffuseShadingFactors, type FinsSpec, type OverhangSpec, type ShadingSpec } from "./device-specs";
export { finShadedWidthM, horizontalShadowAngleRad, overhangShadedHeightM, profileAngleRad } from "./beam-infinite-devices";
export { PreparedShading, prepareShading, sunlitFractionAt } from "./prepared-shading";
