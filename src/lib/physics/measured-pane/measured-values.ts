/**
 * Measured normal-incidence values of a pane (T, Rf, Rb per band), their checks, and the error
 * raised for values that cannot describe a pane. Values are fractions [-]; thickness in m.
 */

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

/** Checks a pane thickness: finite, in (0, 1] m. @throws MeasuredPaneError naming "thicknessM" */
export function checkThickness(thicknessM: number): void {
  if (!Number.isFinite(thicknessM) || thicknessM <= 0 || thicknessM > 1) {
    throw new MeasuredPaneError("thicknessM", "thickness", `pane thickness must be finite, in (0, 1] m; got ${thicknessM}`);
  }
}

/** Checks a fraction in [0, 1]. @throws MeasuredPaneError naming the quantity */
export function checkFraction(v: number, quantity: string): void {
  if (!(v >= 0 && v <= 1)) {
    throw new MeasuredPaneError(quantity, "not-a-fraction", `must be a finite fraction in [0, 1]; got ${v}`);
  }
}

/** Checks one band's T, Rf, Rb: fractions with T + Rf ≤ 1 and T + Rb ≤ 1. @throws MeasuredPaneError naming the quantity */
export function checkMeasuredValues(v: MeasuredValues, band: string): void {
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
