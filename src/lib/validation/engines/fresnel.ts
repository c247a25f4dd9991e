/** The engine's values of the quantities a Fresnel case names (src/lib/physics/fresnel.ts). */
import { brewsterAngle, criticalAngle, fresnelInterface, snellRefractionAngle } from "@/lib/physics/fresnel";
import { toDegrees } from "@/lib/physics/units";
import type { FresnelCaseInput } from "@/lib/reference-cases/fresnel";
import type { Evaluation } from "../types";
import { deg } from "./angles";

export function fresnelValues(input: FresnelCaseInput): Record<string, number> {
  switch (input.kind) {
    case "absorbing-interface": {
      const f = fresnelInterface(input.n1, input.n2, deg(input.thetaDeg));
      return { Rs: f.Rs, Rp: f.Rp, R: f.R, Ts: f.Ts, Tp: f.Tp };
    }
    case "interface": {
      const f = fresnelInterface(input.n1, input.n2, deg(input.thetaDeg));
      const thetaT = snellRefractionAngle(input.n1, input.n2, deg(input.thetaDeg));
      return {
        Rs: f.Rs,
        Rp: f.Rp,
        R: f.R,
        Ts: f.Ts,
        Tp: f.Tp,
        "rs.re": f.rs.re,
        "rp.re": f.rp.re,
        "rs.im": f.rs.im,
        "rp.im": f.rp.im,
        "ts.re": f.ts.re,
        "tp.re": f.tp.re,
        "qx.re": f.qx.re,
        "qx.im": f.qx.im,
        argRsDeg: (f.rs.arg() * 180) / Math.PI,
        argRpDeg: (f.rp.arg() * 180) / Math.PI,
        ...(thetaT === null ? {} : { thetaTDeg: toDegrees(thetaT) }),
      };
    }
    case "brewster": {
      const b = brewsterAngle(input.n1, input.n2);
      const f = fresnelInterface(input.n1, input.n2, b);
      return { brewsterAngleDeg: toDegrees(b), Rs: f.Rs, Rp: f.Rp };
    }
    case "critical": {
      const c = criticalAngle(input.n1, input.n2);
      return c === null ? {} : { criticalAngleDeg: toDegrees(c) };
    }
    case "reciprocity": {
      const thetaT = snellRefractionAngle(input.n1, input.n2, deg(input.thetaDeg));
      if (thetaT === null) return {};
      const back = fresnelInterface(input.n2, input.n1, thetaT);
      return { thetaTDeg: toDegrees(thetaT), RsBack: back.Rs, RpBack: back.Rp };
    }
  }
}

export const evaluateFresnel = (c: { readonly input: FresnelCaseInput }): Evaluation => ({ values: fresnelValues(c.input) });
