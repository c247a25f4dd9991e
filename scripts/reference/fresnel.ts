/**
 * Independent recomputation of the Fresnel reference cases (src/lib/reference-cases/fresnel.ts).
 *
 * Formula: the Fresnel equations and Snell's law for a planar interface, as printed in
 *   E. Hecht, Optics, 4th ed., Addison-Wesley 2002, §4.6, and
 *   M. Born & E. Wolf, Principles of Optics, 7th ed., Cambridge University Press 1999, §1.5
 *   (section numbers from memory):
 *     n1 sin θi = n2 sin θt,  cos θt = sqrt(1 − (n1/n2)² sin² θi)   (complex root, Im(n2 cos θt) ≥ 0)
 *     r_s = (n1 cos θi − n2 cos θt)/(n1 cos θi + n2 cos θt)
 *     r_p = (n1 cos θt − n2 cos θi)/(n1 cos θt + n2 cos θi)        (sign convention r_p(0) = r_s(0);
 *                                                                   Hecht and Born & Wolf use the opposite sign of r_p)
 *     R_j = |r_j|², R = (R_s + R_p)/2;  Brewster θB = atan(n2/n1);  critical θc = asin(n2/n1), n1 > n2.
 * Written from these formulas alone, with complex.js for complex arithmetic; it does not use the product's code.
 *
 * Run: npx tsx scripts/reference/fresnel.ts
 */
import Complex from "complex.js";
import { FRESNEL_SCRIPT, fresnelDomain, type FresnelCaseInput } from "@/lib/reference-cases/fresnel";
import { compareDomain, PRINTED_DIGITS, runWhenMain, type Recomputed } from "./compare";

const DEG = Math.PI / 180;

export interface InterfaceAmplitudes {
  readonly rs: Complex;
  readonly rp: Complex;
  /** cos θt (complex beyond the critical angle). */
  readonly cosT: Complex;
  readonly Rs: number;
  readonly Rp: number;
}

/** Fresnel amplitudes and reflectances for real n1, n2 at angle theta (radians). */
export function interfaceAt(n1: number, n2: number, theta: number): InterfaceAmplitudes {
  const ci = Math.cos(theta);
  const s = (n1 / n2) * Math.sin(theta);
  let cosT = new Complex(1 - s * s, 0).sqrt(); // principal root: Im ≥ 0 when 1 − s² < 0 (decaying branch)
  if (cosT.im < 0) cosT = cosT.neg();
  const a = new Complex(n1 * ci, 0);
  const b = cosT.mul(n2);
  const rs = a.sub(b).div(a.add(b));
  const c = cosT.mul(n1);
  const d = new Complex(n2 * ci, 0);
  const rp = c.sub(d).div(c.add(d));
  const abs2 = (z: Complex) => z.re * z.re + z.im * z.im;
  return { rs, rp, cosT, Rs: abs2(rs), Rp: abs2(rp) };
}

/** All quantities the Fresnel cases name, for one case input. */
export function recomputeFresnel(input: FresnelCaseInput): Recomputed {
  switch (input.kind) {
    case "interface": {
      const f = interfaceAt(input.n1, input.n2, input.thetaDeg * DEG);
      const qx = f.cosT.mul(input.n2);
      const out: Record<string, number> = {
        Rs: f.Rs,
        Rp: f.Rp,
        R: 0.5 * (f.Rs + f.Rp),
        "rs.re": f.rs.re,
        "rp.re": f.rp.re,
        "qx.re": qx.re,
        "qx.im": qx.im,
        argRsDeg: Math.atan2(f.rs.im, f.rs.re) / DEG,
        argRpDeg: Math.atan2(f.rp.im, f.rp.re) / DEG,
      };
      const sinT = (input.n1 / input.n2) * Math.sin(input.thetaDeg * DEG);
      if (sinT <= 1) out.thetaTDeg = Math.asin(sinT) / DEG;
      return out;
    }
    case "brewster": {
      const thetaB = Math.atan(input.n2 / input.n1);
      const f = interfaceAt(input.n1, input.n2, thetaB);
      return { brewsterAngleDeg: thetaB / DEG, Rs: f.Rs, Rp: f.Rp };
    }
    case "critical":
      return { criticalAngleDeg: Math.asin(input.n2 / input.n1) / DEG };
    case "absorbing-interface":
      throw new Error("absorbing-interface cases are closed forms; this script recomputes the computed cases only");
    case "reciprocity": {
      const thetaT = Math.asin((input.n1 / input.n2) * Math.sin(input.thetaDeg * DEG));
      const back = interfaceAt(input.n2, input.n1, thetaT);
      return { thetaTDeg: thetaT / DEG, RsBack: back.Rs, RpBack: back.Rp };
    }
  }
}

/** Every case of the domain this script answers for, next to its recomputation. */
export const fresnelComparison = () =>
  compareDomain(fresnelDomain, FRESNEL_SCRIPT, (c) => recomputeFresnel(c.input), { rule: PRINTED_DIGITS, closedForm: false });

runWhenMain(import.meta.url, [[fresnelDomain.title, fresnelComparison]]);
