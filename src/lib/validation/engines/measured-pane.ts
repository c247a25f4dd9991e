/** The engine's values of the quantities a measured-pane case names (src/lib/physics/measured-pane). */
import {
  invertUncoatedPane,
  karlssonRoosTransmittanceRatio,
  measuredBandAt,
  prepareMeasuredPane,
  type MeasuredBandModel,
} from "@/lib/physics/measured-pane";
import type { Radians } from "@/lib/physics/units";
import type { MeasuredPaneCaseInput } from "@/lib/reference-cases/measured-pane";
import type { Evaluation } from "../types";
import { deg } from "./angles";

const unpolarized = (model: MeasuredBandModel, theta: Radians) => {
  const l = measuredBandAt(model, theta);
  return { T: 0.5 * (l.s.T + l.p.T), Rf: 0.5 * (l.s.Rf + l.p.Rf), Rb: 0.5 * (l.s.Rb + l.p.Rb) };
};

export function measuredPaneValues(input: MeasuredPaneCaseInput): Record<string, number> {
  switch (input.kind) {
    case "inversion": {
      const inv = invertUncoatedPane(input.T, input.R, input.thicknessMm / 1000);
      return {
        b: inv.b,
        faceReflectance: inv.faceReflectance,
        internalTransmittance: inv.internalTransmittance,
        refractiveIndex: inv.refractiveIndex,
        absorptionPerMm: inv.absorptionPerM / 1000,
      };
    }
    case "uncoated-at-angle": {
      const pane = prepareMeasuredPane({ thicknessM: input.thicknessMm / 1000, solar: input.solar });
      const o = unpolarized(pane.solar, deg(input.thetaDeg));
      return { T: o.T, Rf: o.Rf, Rb: o.Rb, A: 1 - o.T - o.Rf };
    }
    case "karlsson-roos":
      return { TOverT0: karlssonRoosTransmittanceRatio(deg(input.thetaDeg), input.p, input.q) };
  }
}

export const evaluateMeasuredPane = (c: { readonly input: MeasuredPaneCaseInput }): Evaluation => ({ values: measuredPaneValues(c.input) });
