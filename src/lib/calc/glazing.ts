/**
 * The glazing calculation behind POST /api/v1/calc/glazing: converts the request (millimetres,
 * per-millimetre absorption) to the physics core's SI units, evaluates the optics at each
 * requested angle and over the hemisphere, and combines them with the EN 673 / EN 410 thermal
 * network into g-values and the U-value. Pure (no I/O), so it also runs in the browser.
 */
import { lowEFaces } from "./makeup-description";
import type { Gap, Gas, GlazingRequest, GlazingResponse, GlazingValues, Pane } from "@/lib/contracts/glazing";
import { DEFAULT_EMISSIVITY } from "@/lib/contracts/glazing";
import { prepareGlazing, type GlazingOptics, type PaneSpec, type PreparedGlazing } from "@/lib/physics/optics";
import { gValue, secondaryHeatTransferFactorsEn410, type SecondaryHeatTransferResult } from "@/lib/physics/g-value";
import type { GasFill } from "@/lib/physics/gas-properties";
import { toRadians, type Degrees } from "@/lib/physics/units";
import { lightTransmittanceBounds } from "@/lib/physics/light-transmittance-bounds";
import type { LightSummary } from "@/lib/contracts/glazing";

/** Pane absorptance (sun from outdoors, normal incidence) above which thermal stress needs checking (common practice, no source). */
export const THERMAL_STRESS_ABSORPTANCE = 0.5;
/** Gap widths outside which EN 673's convection correlation is used beyond its usual range (common practice, no source). */
export const TYPICAL_GAP_MM = { min: 6, max: 25 } as const;

const MM = 1e-3;

export function paneSpec(p: Pane): PaneSpec {
  if ("measured" in p) {
    const m = p.measured;
    return {
      kind: "measured",
      thicknessM: p.thicknessMm * MM,
      solar: { T: m.solarTransmittance, Rf: m.solarReflectanceFront, Rb: m.solarReflectanceBack },
      visible:
        m.visibleTransmittance !== undefined && m.visibleReflectanceFront !== undefined && m.visibleReflectanceBack !== undefined
          ? { T: m.visibleTransmittance, Rf: m.visibleReflectanceFront, Rb: m.visibleReflectanceBack }
          : undefined,
    };
  }
  return { kind: "physical", thicknessM: p.thicknessMm * MM, refractiveIndex: p.refractiveIndex, absorptionPerM: p.absorptionPerMm / MM };
}

/** Gas fractions scaled to sum exactly to 1 (the request allows ±0.001 for typed-in percentages). */
export function gasFill(gas: Gas): GasFill {
  if (typeof gas === "string") return gas;
  const sum = (gas.air ?? 0) + (gas.argon ?? 0) + (gas.krypton ?? 0);
  const out: Partial<Record<"air" | "argon" | "krypton", number>> = {};
  for (const k of ["air", "argon", "krypton"] as const) if (gas[k]) out[k] = gas[k]! / sum;
  return out;
}

export interface GlazingModel {
  panes: Pane[];
  gaps: Gap[];
  optics: PreparedGlazing;
  thermal: SecondaryHeatTransferResult;
}

/** Prepares the optics and the thermal network of a make-up once; reused for many angles. */
export function prepareGlazingModel(req: Pick<GlazingRequest, "layers" | "polarization" | "tiltDeg">): GlazingModel {
  const panes = req.layers.filter((l): l is Pane => l.kind === "pane");
  const gaps = req.layers.filter((l): l is Gap => l.kind === "gap");
  const optics = prepareGlazing(panes.map(paneSpec), { polarization: req.polarization });
  const thermal = secondaryHeatTransferFactorsEn410(
    {
      panes: panes.map((p) => ({
        thicknessM: p.thicknessMm * MM,
        emissivityFront: p.emissivityFront ?? DEFAULT_EMISSIVITY,
        emissivityBack: p.emissivityBack ?? DEFAULT_EMISSIVITY,
      })),
      gaps: gaps.map((g) => ({ widthM: g.widthMm * MM, gas: gasFill(g.gas) })),
    },
    { tiltDeg: req.tiltDeg },
  );
  return { panes, gaps, optics, thermal };
}

/**
 * The unit's light transmittance at normal incidence: from the angular optics when every pane has all
 * three light values; from the bounds of the adding method when some pane gives τv alone.
 */
export function lightSummary(panes: readonly Pane[], optics: PreparedGlazing): LightSummary {
  if (optics.hasVisible) {
    const v = optics.at(toRadians(0 as Degrees)).visible!;
    return { basis: "measured", transmittance: v.T, range: { low: v.T, high: v.T }, reflectanceFront: v.Rf, reflectanceBack: v.Rb };
  }
  const light = panes.map((p) => ("measured" in p && p.measured.visibleTransmittance !== undefined ? p.measured : null));
  if (light.some((m) => m === null)) return { basis: "not given", transmittance: null, range: null, reflectanceFront: null, reflectanceBack: null };
  const b = lightTransmittanceBounds(
    light.map((m) => ({ T: m!.visibleTransmittance!, Rf: m!.visibleReflectanceFront, Rb: m!.visibleReflectanceBack })),
  );
  return {
    basis: "transmittance only",
    transmittance: b.exact ? b.low : null,
    range: { low: b.low, high: b.high },
    reflectanceFront: null,
    reflectanceBack: null,
  };
}

const round12 = (x: number) => Math.round(x * 1e12) / 1e12;

export function calculateGlazing(req: GlazingRequest): GlazingResponse {
  const model = prepareGlazingModel(req);
  const N = model.thermal.factors;
  const values = (o: GlazingOptics): GlazingValues => ({
    solarTransmittance: o.solar.T,
    solarReflectanceFront: o.solar.Rf,
    solarReflectanceBack: o.solar.Rb,
    layerAbsorptance: [...o.solar.absorptanceFront],
    gValue: gValue(o.solar.T, o.solar.absorptanceFront, N),
    visibleTransmittance: o.visible?.T ?? null,
    visibleReflectanceFront: o.visible?.Rf ?? null,
    visibleReflectanceBack: o.visible?.Rb ?? null,
  });

  const light = lightSummary(model.panes, model.optics);
  // τv known at normal incidence only (panes giving τv alone): the 0° row carries it, other angles stay unknown.
  const normalOnly = light.basis === "transmittance only" ? light.transmittance : null;
  const angles = req.anglesDeg.map((angleDeg) => {
    const v = values(model.optics.at(toRadians(angleDeg as Degrees)));
    return { angleDeg, ...v, ...(angleDeg === 0 && normalOnly !== null ? { visibleTransmittance: normalOnly } : {}) };
  });
  const h = model.optics.hemispherical();
  const normal = model.optics.at(toRadians(0 as Degrees));
  const u = model.thermal.thermal;

  const warnings = model.optics.warnings.map((w) => w.message);
  normal.solar.absorptanceFront.forEach((a, k) => {
    if (a > THERMAL_STRESS_ABSORPTANCE) {
      warnings.push(
        `Pane ${k + 1} absorbs ${(a * 100).toFixed(0)} % of the sun at normal incidence: highly absorbing glass that is partly shaded can break from thermal stress. Have a thermal-safety assessment made (heat-strengthened or toughened glass may be needed).`,
      );
    }
  });
  model.gaps.forEach((gap, k) => {
    if (gap.widthMm < TYPICAL_GAP_MM.min || gap.widthMm > TYPICAL_GAP_MM.max) {
      warnings.push(
        `Gap ${k + 1} is ${gap.widthMm} mm wide; EN 673's gap correlation is meant for the usual ${TYPICAL_GAP_MM.min}–${TYPICAL_GAP_MM.max} mm cavities, so treat its U-value as indicative.`,
      );
    }
  });
  req.layers
    .filter((l): l is Pane => l.kind === "pane")
    .forEach((pane, k) => {
      if ("measured" in pane) return;
      const faces = lowEFaces(pane, k);
      if (faces.length === 0) return;
      warnings.push(
        `Pane ${k + 1} has a low-emissivity coating (face ${faces.map((f) => `#${f}`).join(" and ")}) but is described by glass properties: the emissivity enters the U-value and the heat flow, yet the coating's solar optics are not modelled, so τe and the g-value of this make-up are overstated. Describe the coated pane by its measured values (the maker's data sheet) instead.`,
      );
    });
  if (light.basis === "not given") {
    warnings.push("Light transmittance needs measured light values (τv at least) for every pane; it is not given for this make-up.");
  } else if (light.basis === "transmittance only") {
    warnings.push(
      light.transmittance !== null
        ? "Light transmittance is the data sheet's τv at normal incidence; light reflectance is unknown, and τv at other angles and for diffuse light is not given."
        : `Some panes give light transmittance alone, so the light reflectances inside the unit are unknown: τv at normal incidence lies between ${light.range!.low.toFixed(3)} and ${light.range!.high.toFixed(3)} (adding method with those reflectances at 0 and at their largest possible value). Requirements on τv are checked against this range.`,
    );
  }
  if (req.tiltDeg !== 90) {
    warnings.push(`U-value for glazing tilted ${req.tiltDeg}° from horizontal: EN 673 declared values are for vertical glazing.`);
  }

  return {
    angles,
    hemispherical: values(h),
    uValue: u.uValueWPerM2K,
    warnings,
    light,
    // Extra fields: the intermediate values a consultant checks.
    uValueRounded: Math.round(u.uValueWPerM2K * 10) / 10,
    methods: {
      optics: `broadband Fresnel optics per pane, net-radiation stack ${req.polarization === "per-polarization" ? "solved for s and p separately then averaged" : "with each pane's s and p averaged first (simplification)"}`,
      uValue: u.label,
      gValue: `${model.thermal.standard}: g = τe + Σ N_k·α_k, N_k from the EN 673 thermal network (fixed at normal incidence for other angles)`,
      hemispherical: "cosine-weighted average over the hemisphere (isotropic diffuse light), Gauss–Legendre quadrature",
    },
    thermal: {
      standard: u.standard,
      externalCoefficientWPerM2K: u.externalCoefficientWPerM2K,
      internalCoefficientWPerM2K: u.internalCoefficientWPerM2K,
      secondaryHeatTransferFactors: N.map(round12),
      gaps: u.gaps.map((gp) => ({
        temperatureDifferenceK: gp.temperatureDifferenceK,
        radiativeConductanceWPerM2K: gp.radiativeConductanceWPerM2K,
        gasConductanceWPerM2K: gp.gasConductanceWPerM2K,
        conductanceWPerM2K: gp.conductanceWPerM2K,
        nusselt: gp.nusselt,
      })),
    },
  };
}
