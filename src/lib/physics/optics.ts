/**
 * Optics of a whole glazing (1..6 parallel panes, outdoor side first, air/gas gaps with n = 1):
 * prepare once, then evaluate at any angle of incidence or as a hemispherical average.
 *
 * - Physical panes (thickness, n, α): slab model per polarisation (absorbing-pane.ts); solar only.
 * - Measured panes: uncoated ones are inverted to an equivalent slab, coated ones get the
 *   estimated angular model (measured-pane/); solar and, when given, visible.
 * - Stack: net-radiation method, solved by PolarizedStackSolver (layer-stack.ts, the one solver
 *   behind glazingOpticsAt too), by default per polarisation (s and p stacks
 *   averaged at the end); "averaged" (each pane averaged first) is available as a labelled
 *   simplification.
 * - Hemispherical values integrate the whole stack's T, R and A over the hemisphere with the
 *   sin 2θ weight (hemispherical.ts), i.e. the stack is solved at each node, not per pane.
 *
 * @see EN 410:2011 §5; ISO 9050:2003 §4; ISO 15099:2003 (clauses from memory)
 */
import { absorbingPaneOpticsUnchecked, checkAbsorbingPane, type AbsorbingPaneSpec } from "./absorbing-pane";
import { DEFAULT_HEMISPHERICAL_NODES, hemisphericalQuadrature } from "./hemispherical";
import {
  checkLayer,
  checkLayerCount,
  checkPolarizationRoute,
  PolarizedStackSolver,
  stackOpticsFromResult,
  stackResultLength,
  type PolarizationRoute,
  type PolarizedLayerOptics,
  type StackOptics,
} from "./layer-stack";
import {
  measuredBandAtUnchecked,
  MeasuredPaneError,
  PLAUSIBLE_GLASS_INDEX_RANGE,
  prepareMeasuredPane,
  type MeasuredBandModel,
  type MeasuredValues,
} from "./measured-pane";
import { checkIncidenceAngleRad, NORMAL_INCIDENCE_RAD, type Radians } from "./units";

/** One pane of a glazing, SI units; "f" faces outdoors. */
export type PaneSpec =
  | {
      readonly kind: "physical";
      /** thickness [m] */
      readonly thicknessM: number;
      /** real refractive index [-] */
      readonly refractiveIndex: number;
      /** Beer–Lambert absorption coefficient [1/m] */
      readonly absorptionPerM: number;
    }
  | {
      readonly kind: "measured";
      /** thickness [m] */
      readonly thicknessM: number;
      /** measured normal-incidence solar T, Rf, Rb [-] */
      readonly solar: MeasuredValues;
      /** measured normal-incidence visible T, Rf, Rb [-] */
      readonly visible?: MeasuredValues;
    };

/** Glazing optics: solar always; visible only when every pane has measured visible values. */
export interface GlazingOptics {
  /** T, Rf, Rb and per-pane absorptances from outdoors and from indoors (index 0 = outermost pane) */
  readonly solar: StackOptics;
  readonly visible: StackOptics | null;
}

/** Something the user should know about how the values were obtained. */
export interface GlazingWarning {
  readonly code: "coated-angular-estimate" | "unusual-equivalent-index" | "averaged-polarization";
  /** pane index (0 = outermost), or null for the whole glazing */
  readonly paneIndex: number | null;
  readonly message: string;
}

/** How each pane was modelled (for display and reports). */
export type PaneModelInfo =
  | { readonly kind: "physical"; readonly pane: AbsorbingPaneSpec }
  | {
      readonly kind: "measured";
      readonly coated: boolean;
      readonly solar: MeasuredBandModel;
      readonly visible: MeasuredBandModel | null;
    };

/** Options of {@link prepareGlazing}. */
export interface GlazingOpticsOptions {
  /** default "per-polarization" */
  readonly polarization?: PolarizationRoute;
  /** Gauss–Legendre nodes of the hemispherical average, default 64, at least 20 */
  readonly hemisphericalNodes?: number;
  /** Karlsson–Roos glazing-type index q for coated panes, default 4 */
  readonly karlssonRoosQ?: number;
}

/** A glazing prepared for repeated evaluation. */
export interface PreparedGlazing {
  readonly paneCount: number;
  readonly polarization: PolarizationRoute;
  readonly hasVisible: boolean;
  readonly panes: readonly PaneModelInfo[];
  readonly warnings: readonly GlazingWarning[];
  /**
   * Optics at one angle of incidence in air on the outer face.
   * @param thetaRad [rad], in [0, π/2]
   * @throws RangeError for an angle out of range
   */
  at(thetaRad: Radians): GlazingOptics;
  /** Hemispherical (diffuse, isotropic radiance) averages of T, Rf, Rb and each absorptance; computed once. */
  hemispherical(): GlazingOptics;
}

type LayerFn = (thetaRad: Radians) => PolarizedLayerOptics;

const physicalLayer =
  (pane: AbsorbingPaneSpec): LayerFn =>
  (thetaRad) => {
    const o = absorbingPaneOpticsUnchecked(pane, thetaRad);
    return { s: { T: o.s.T, Rf: o.s.R, Rb: o.s.R }, p: { T: o.p.T, Rf: o.p.R, Rb: o.p.R } };
  };

const measuredLayer =
  (model: MeasuredBandModel): LayerFn =>
  (thetaRad) =>
    measuredBandAtUnchecked(model, thetaRad);

function paneKey(spec: PaneSpec): string {
  return spec.kind === "physical"
    ? `p|${spec.thicknessM}|${spec.refractiveIndex}|${spec.absorptionPerM}`
    : `m|${spec.thicknessM}|${spec.solar.T}|${spec.solar.Rf}|${spec.solar.Rb}|` +
        (spec.visible ? `${spec.visible.T}|${spec.visible.Rf}|${spec.visible.Rb}` : "-");
}

/** One band of the glazing: unique layer models, pane → model map, and the stack solver. */
class BandSolver {
  private readonly cache: PolarizedLayerOptics[];
  private readonly layers: PolarizedLayerOptics[];
  private readonly stack: PolarizedStackSolver;

  constructor(
    private readonly models: readonly LayerFn[],
    private readonly paneToModel: readonly number[],
    route: PolarizationRoute,
  ) {
    this.cache = new Array<PolarizedLayerOptics>(models.length);
    this.layers = new Array<PolarizedLayerOptics>(paneToModel.length);
    this.stack = new PolarizedStackSolver(paneToModel.length, route);
  }

  /** Solves the band at θ; returns the buffer with the s/p average (layout of solveStackInto). */
  solve(thetaRad: Radians): Float64Array {
    for (let m = 0; m < this.models.length; m++) this.cache[m] = this.models[m]!(thetaRad);
    for (let k = 0; k < this.paneToModel.length; k++) this.layers[k] = this.cache[this.paneToModel[k]!]!;
    return this.stack.solve(this.layers);
  }
}

function freezeBand(b: StackOptics): StackOptics {
  return Object.freeze({ ...b, absorptanceFront: Object.freeze([...b.absorptanceFront]), absorptanceBack: Object.freeze([...b.absorptanceBack]) });
}

function fmt(x: number): string {
  return x.toFixed(3);
}

/**
 * Prepares a glazing for evaluation: validates each pane, inverts uncoated measured panes,
 * sets up coated-pane models, shares models between identical panes, and collects warnings.
 * @param panes 1..6 panes, outdoor side first
 * @param options polarisation route, hemispherical node count, Karlsson–Roos q
 * @returns an evaluator; `at(θ)` gives T, Rf, Rb and per-pane A (from outdoors and from
 *   indoors) in the solar band and, when every pane has measured visible values, the visible band
 * @throws RangeError (MeasuredPaneError for measured values) naming the pane and the quantity
 * @see EN 410:2011 §5; ISO 9050:2003 §4; ISO 15099:2003 (from memory)
 */
export function prepareGlazing(panes: readonly PaneSpec[], options: GlazingOpticsOptions = {}): PreparedGlazing {
  const n = panes.length;
  checkLayerCount(n, "panes");
  const route = checkPolarizationRoute(options.polarization ?? "per-polarization");
  const nodes = options.hemisphericalNodes ?? DEFAULT_HEMISPHERICAL_NODES;
  if (!Number.isInteger(nodes) || nodes < 20) {
    throw new RangeError(`hemisphericalNodes must be an integer ≥ 20; got ${nodes}`);
  }
  hemisphericalQuadrature(nodes); // validates the upper bound

  const warnings: GlazingWarning[] = [];
  const infos: PaneModelInfo[] = [];
  const keyToModel = new Map<string, number>();
  const solarModels: LayerFn[] = [];
  const visibleModels: (LayerFn | null)[] = [];
  const paneToModel: number[] = [];

  panes.forEach((spec, i) => {
    const where = `pane ${i + 1}`;
    const key = paneKey(spec);
    const known = keyToModel.get(key);
    if (known !== undefined) {
      paneToModel.push(known);
      infos.push(infos[panes.findIndex((p) => paneKey(p) === key)]!);
      return;
    }
    let info: PaneModelInfo;
    if (spec.kind === "physical") {
      let pane: AbsorbingPaneSpec;
      try {
        pane = checkAbsorbingPane(spec);
      } catch (e) {
        throw new RangeError(`${where}: ${(e as Error).message}`);
      }
      solarModels.push(physicalLayer(pane));
      visibleModels.push(null);
      info = { kind: "physical", pane };
    } else if (spec.kind === "measured") {
      let prepared;
      try {
        prepared = prepareMeasuredPane(spec, { karlssonRoosQ: options.karlssonRoosQ });
      } catch (e) {
        if (e instanceof MeasuredPaneError) {
          throw new MeasuredPaneError(`${where} ${e.quantity}`, e.reason, e.message.slice(e.quantity.length + 2));
        }
        throw new RangeError(`${where}: ${(e as Error).message}`);
      }
      solarModels.push(measuredLayer(prepared.solar));
      visibleModels.push(prepared.visible ? measuredLayer(prepared.visible) : null);
      info = { kind: "measured", coated: prepared.coated, solar: prepared.solar, visible: prepared.visible };
    } else {
      throw new RangeError(`${where}: unknown pane kind ${String((spec as { kind: unknown }).kind)}`);
    }
    keyToModel.set(key, solarModels.length - 1);
    paneToModel.push(solarModels.length - 1);
    infos.push(info);
  });

  infos.forEach((info, i) => {
    if (info.kind !== "measured") return;
    if (info.coated) {
      warnings.push({
        code: "coated-angular-estimate",
        paneIndex: i,
        message:
          `pane ${i + 1} is coated (front and back reflectance differ): its values away from normal ` +
          `incidence are estimated (Karlsson–Roos transmittance curve, reference-curve reflectance) and ` +
          `may be off by several percentage points beyond 60°`,
      });
      return;
    }
    for (const [band, model] of [
      ["solar", info.solar],
      ["visible", info.visible],
    ] as const) {
      if (model?.kind !== "uncoated") continue;
      const nEq = model.inversion.refractiveIndex;
      if (nEq < PLAUSIBLE_GLASS_INDEX_RANGE.min || nEq > PLAUSIBLE_GLASS_INDEX_RANGE.max) {
        warnings.push({
          code: "unusual-equivalent-index",
          paneIndex: i,
          message:
            `pane ${i + 1} (${band}): the measured values imply an equivalent refractive index of ${fmt(nEq)}, ` +
            `unusual for window glass (${PLAUSIBLE_GLASS_INDEX_RANGE.min}–${PLAUSIBLE_GLASS_INDEX_RANGE.max}); ` +
            `check that T and R were measured on one uncoated pane`,
        });
      }
    }
  });
  if (route === "averaged") {
    warnings.push({
      code: "averaged-polarization",
      paneIndex: null,
      message: "polarisation averaged pane by pane: a simplification that underestimates transmittance at oblique incidence",
    });
  }

  const solar = new BandSolver(solarModels, paneToModel, route);
  const hasVisible = visibleModels.every((m) => m !== null);
  const visible = hasVisible ? new BandSolver(visibleModels as LayerFn[], paneToModel, route) : null;

  const at = (thetaRad: Radians): GlazingOptics => {
    checkIncidenceAngleRad(thetaRad);
    const s = stackOpticsFromResult(n, solar.solve(thetaRad));
    return { solar: s, visible: visible ? stackOpticsFromResult(n, visible.solve(thetaRad)) : null };
  };

  let hemi: GlazingOptics | null = null;
  const hemispherical = (): GlazingOptics => {
    if (hemi) return hemi;
    const { thetaRad, weight } = hemisphericalQuadrature(nodes);
    const len = stackResultLength(n);
    const accS = new Float64Array(len);
    const accV = visible ? new Float64Array(len) : null;
    for (let i = 0; i < thetaRad.length; i++) {
      const th = thetaRad[i] as Radians;
      const w = weight[i]!;
      const bs = solar.solve(th);
      for (let j = 0; j < len; j++) accS[j] = accS[j]! + w * bs[j]!;
      if (visible && accV) {
        const bv = visible.solve(th);
        for (let j = 0; j < len; j++) accV[j] = accV[j]! + w * bv[j]!;
      }
    }
    hemi = Object.freeze({
      solar: freezeBand(stackOpticsFromResult(n, accS)),
      visible: accV ? freezeBand(stackOpticsFromResult(n, accV)) : null,
    });
    return hemi;
  };

  // Sanity check at normal incidence: catches a model that produces an invalid layer.
  for (const m of [...solarModels, ...visibleModels]) {
    if (!m) continue;
    const l = m(NORMAL_INCIDENCE_RAD);
    checkLayer(l.s);
    checkLayer(l.p);
  }

  return Object.freeze({
    paneCount: n,
    polarization: route,
    hasVisible,
    panes: Object.freeze(infos),
    warnings: Object.freeze(warnings),
    at,
    hemispherical,
  });
}
