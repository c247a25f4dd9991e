/** The engine's values of the quantities an absorbing-pane case names (src/lib/physics/absorbing-pane.ts). */
import { absorbingPaneOptics, slabFromFaceReflectance } from "@/lib/physics/absorbing-pane";
import { fresnelReflectancesReal } from "@/lib/physics/fresnel";
import { asRadians, toDegrees } from "@/lib/physics/units";
import type { AbsorbingPaneCaseInput } from "@/lib/reference-cases/absorbing-pane";
import type { Evaluation } from "../types";
import { deg, paneFromMm } from "./angles";

export function absorbingPaneValues(input: AbsorbingPaneCaseInput): Record<string, number> {
  const spec = paneFromMm(input.pane);
  const theta = deg(input.thetaDeg);
  const o = absorbingPaneOptics(spec, theta);
  const face = fresnelReflectancesReal(1, spec.refractiveIndex, theta);
  return {
    thetaTDeg: toDegrees(asRadians(Math.acos(o.cosThetaT))),
    tau: o.internalTransmittance,
    Ts: o.s.T,
    Rs: o.s.R,
    As: o.s.A,
    Tp: o.p.T,
    Rp: o.p.R,
    Ap: o.p.A,
    T: o.T,
    R: o.R,
    A: o.A,
    TOverT0: o.T / absorbingPaneOptics(spec, deg(0)).T,
    // the common error of averaging R_s and R_p before the slab series, for comparison
    TAveragedFaces: slabFromFaceReflectance(0.5 * (face.Rs + face.Rp), o.internalTransmittance).T,
  };
}

export const evaluateAbsorbingPane = (c: { readonly input: AbsorbingPaneCaseInput }): Evaluation => ({ values: absorbingPaneValues(c.input) });
