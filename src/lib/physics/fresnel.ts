/**
 * Optics of one planar interface between two homogeneous, isotropic media (Fresnel).
 *
 * Wave-vector form. With the angle of incidence θ in medium 1 and k0 the vacuum wave number,
 *   k_x = n1 cos θ                       normal wave-vector component in medium 1 [in units of k0]
 *   q_x = sqrt(n2² − n1² sin² θ)         normal wave-vector component in medium 2 [in units of k0],
 *                                        complex in general; branch Im(q_x) ≥ 0 (field decays
 *                                        away from the interface, convention N = n + ik, e^{i(kz−ωt)})
 *   r_s = (k_x − q_x) / (k_x + q_x)                     t_s = 2 k_x / (k_x + q_x)
 *   r_p = (n1² q_x − n2² k_x) / (n1² q_x + n2² k_x)     t_p = 2 n1 n2 k_x / (n1² q_x + n2² k_x)
 * Since q_x = n2 cos θt, these are the usual Fresnel equations; written this way they need no
 * special case for total internal reflection (q_x imaginary, |r| = 1) or absorbing media.
 * Sign convention: r_p(0) = r_s(0) = (n1 − n2)/(n1 + n2). Hecht and Born & Wolf define r_p
 * with the opposite overall sign (r_p(0) = −r_s(0)); the choice changes phases only, never R or T.
 *
 * Medium 1 (the incident medium) must be non-absorbing (real n1), otherwise the angle of
 * incidence and the incident flux are not well defined.
 *
 * @see E. Hecht, Optics, 4th ed., Addison-Wesley 2002, §4.6 (section from memory)
 * @see M. Born & E. Wolf, Principles of Optics, 7th ed., Cambridge 1999, §1.5 (from memory)
 */
import Complex from "complex.js";
import { cosIncidence, checkIncidenceAngleRad, type Radians } from "./units";

/** Refractive index: real, or complex N = n + ik with k ≥ 0 (absorbing); a Complex or any {re, im}. */
export type RefractiveIndex = number | { readonly re: number; readonly im: number };

/** Normal wave-vector components of the incident (k_x, real) and transmitted (q_x) waves, in units of k0. */
export interface NormalWaveVectorComponents {
  readonly kx: number;
  readonly qx: Complex;
}

/** Amplitude coefficients (complex, dimensionless). t_p is the ratio of electric fields. */
export interface FresnelAmplitudes {
  readonly rs: Complex;
  readonly rp: Complex;
  readonly ts: Complex;
  readonly tp: Complex;
}

/** Power (flux) coefficients normal to the interface [-]; R, T are unpolarised means. */
export interface FresnelPower {
  readonly Rs: number;
  readonly Rp: number;
  readonly Ts: number;
  readonly Tp: number;
  readonly R: number;
  readonly T: number;
}

/** Everything about one interface at one angle. */
export interface FresnelInterface extends NormalWaveVectorComponents, FresnelAmplitudes, FresnelPower {}

function checkIncidentIndex(n1: number): void {
  if (!Number.isFinite(n1) || n1 <= 0) {
    throw new RangeError(`refractive index of the incident medium n1 must be finite and > 0; got ${n1}`);
  }
}

function toComplexIndex(n2: RefractiveIndex): Complex {
  const c = typeof n2 === "number" ? new Complex(n2, 0) : new Complex(n2.re, n2.im);
  if (!Number.isFinite(c.re) || !Number.isFinite(c.im) || c.re <= 0 || c.im < 0) {
    throw new RangeError(
      `refractive index of the transmitting medium n2 must be finite with real part > 0 and ` +
        `imaginary part ≥ 0 (N = n + ik); got ${c.re} + ${c.im}i`,
    );
  }
  return c;
}

/**
 * Normal components of the wave vectors at an interface:
 *   k_x = n1 cos θ,  q_x = sqrt(n2² − n1² sin² θ), branch Im(q_x) ≥ 0.
 * @param n1 refractive index of the incident medium [-], real > 0
 * @param n2 refractive index of the transmitting medium [-], real or complex (n + ik, k ≥ 0)
 * @param thetaRad angle of incidence in medium 1 [rad], in [0, π/2]
 * @returns k_x (real) and q_x (complex), in units of the vacuum wave number k0
 * @see Born & Wolf, Principles of Optics, 7th ed., §1.5.4 (branch choice; from memory)
 */
export function normalWaveVectorComponents(n1: number, n2: RefractiveIndex, thetaRad: Radians): NormalWaveVectorComponents {
  checkIncidentIndex(n1);
  const N2 = toComplexIndex(n2);
  checkIncidenceAngleRad(thetaRad);
  return componentsUnchecked(n1, N2, thetaRad);
}

function componentsUnchecked(n1: number, N2: Complex, thetaRad: Radians): NormalWaveVectorComponents {
  const cosI = cosIncidence(thetaRad);
  const sinI = Math.sin(thetaRad);
  const kx = n1 * cosI;
  let qx = N2.mul(N2)
    .sub(n1 * n1 * sinI * sinI)
    .sqrt();
  // Principal root has Re ≥ 0; enforce the decaying branch Im(q_x) ≥ 0 explicitly.
  // (For passive media Im(n2²) ≥ 0, so the principal root already qualifies; this guards signed zeros.)
  if (qx.im < 0) qx = new Complex(-qx.re, -qx.im);
  else if (qx.im === 0 && qx.re < 0) qx = new Complex(-qx.re, 0);
  return { kx, qx };
}

/**
 * Amplitude and power coefficients of one interface, s and p, in wave-vector form (see the
 * module comment for r and t). Power (normal flux) coefficients:
 *   R_j = |r_j|²
 *   T_s = Re(q_x) / k_x · |t_s|²
 *   T_p = Re(q_x / n2²) · n1² / k_x · |t_p^H|²,   t_p^H = (n2/n1) t_p = 2 n2² k_x / (n1² q_x + n2² k_x)
 * The p form follows from the normal Poynting flux of a TM wave, S_x ∝ Re(q_x/ε)|H|², ε = N²;
 * for real n2 it reduces to the familiar (n2 cos θt)/(n1 cos θi)·|t_p|²; carrying that form over
 * to complex n2 as Re(n2 cos θt)/(n1 cos θi)·|t_p|² is right for s but not for p. With a lossless medium 1,
 * T_j + R_j = 1 for each polarisation (T is the flux that crosses the interface, which an
 * absorbing medium 2 then absorbs; see {@link fresnelTransmittanceAtDepth}).
 * At θ = π/2: R = 1, T = 0 exactly. Beyond the critical angle q_x is imaginary: |r| = 1, T = 0.
 * @param n1 refractive index of the incident medium [-], real > 0
 * @param n2 refractive index of the transmitting medium [-], real or complex (n + ik, k ≥ 0)
 * @param thetaRad angle of incidence in medium 1 [rad], in [0, π/2]
 * @returns amplitudes (complex) and power coefficients [-]
 * @throws RangeError naming the quantity for non-finite or out-of-range input
 * @see Hecht, Optics, 4th ed., §4.6 (from memory); Born & Wolf, Principles of Optics, 7th ed.,
 *   §1.5 and the chapter on the optics of metals (from memory)
 */
export function fresnelInterface(n1: number, n2: RefractiveIndex, thetaRad: Radians): FresnelInterface {
  checkIncidentIndex(n1);
  const N2 = toComplexIndex(n2);
  checkIncidenceAngleRad(thetaRad);
  const { kx, qx } = componentsUnchecked(n1, N2, thetaRad);
  if (kx === 0) {
    // Grazing incidence: no incident flux crosses the plane; r → −1 in the limit (also for n1 = n2,
    // where the formulas would read 0/0).
    const m1 = new Complex(-1, 0);
    const zero = new Complex(0, 0);
    return { kx, qx, rs: m1, rp: m1, ts: zero, tp: zero, Rs: 1, Rp: 1, Ts: 0, Tp: 0, R: 1, T: 0 };
  }
  const n1sq = n1 * n1;
  const eps2 = N2.mul(N2);

  const sSum = qx.add(kx);
  const rs = new Complex(kx, 0).sub(qx).div(sSum);
  const ts = new Complex(2 * kx, 0).div(sSum);

  const pa = eps2.mul(kx); // n2² k_x
  const pb = qx.mul(n1sq); // n1² q_x
  const pSum = pa.add(pb);
  const rp = pb.sub(pa).div(pSum);
  const tpH = pa.mul(2).div(pSum);
  const tp = tpH.mul(n1).div(N2);

  const Rs = rs.abs() ** 2;
  const Rp = rp.abs() ** 2;
  const Ts = Math.max(0, (qx.re / kx) * ts.abs() ** 2);
  const Tp = Math.max(0, ((qx.div(eps2).re * n1sq) / kx) * tpH.abs() ** 2);
  return { kx, qx, rs, rp, ts, tp, Rs, Rp, Ts, Tp, R: 0.5 * (Rs + Rp), T: 0.5 * (Ts + Tp) };
}

/**
 * Power reflectance for s-polarised light, R_s = |(k_x − q_x)/(k_x + q_x)|².
 * @param n1 incident medium index [-] (real); @param n2 transmitting medium index [-]
 * @param thetaRad angle of incidence [rad]
 * @returns R_s [-]
 * @see Hecht, Optics, 4th ed., §4.6 (from memory)
 */
export const fresnelReflectanceS = (n1: number, n2: RefractiveIndex, thetaRad: Radians): number => fresnelInterface(n1, n2, thetaRad).Rs;

/**
 * Power reflectance for p-polarised light, R_p = |(n1² q_x − n2² k_x)/(n1² q_x + n2² k_x)|².
 * @param n1 incident medium index [-] (real); @param n2 transmitting medium index [-]
 * @param thetaRad angle of incidence [rad]
 * @returns R_p [-]
 * @see Hecht, Optics, 4th ed., §4.6 (from memory)
 */
export const fresnelReflectanceP = (n1: number, n2: RefractiveIndex, thetaRad: Radians): number => fresnelInterface(n1, n2, thetaRad).Rp;

/** Result of {@link fresnelReflectancesReal}. */
export interface RealInterfaceReflectances {
  /** R_s [-] */
  readonly Rs: number;
  /** R_p [-] */
  readonly Rp: number;
  /** cos θt = q_x / n2 [-], cosine of the refraction angle */
  readonly cosThetaT: number;
}

/**
 * Fast path of {@link fresnelInterface} for real indices below the critical angle
 * (n1 sin θ ≤ n2), where q_x is real: same wave-vector formulas in plain float64, no
 * complex arithmetic. Used by the slab model in hot loops; tests hold it to the complex route.
 *   k_x = n1 cos θ, q_x = sqrt(n2² − n1² sin² θ),
 *   R_s = ((k_x − q_x)/(k_x + q_x))², R_p = ((n1² q_x − n2² k_x)/(n1² q_x + n2² k_x))²
 * @param n1 incident medium index [-], real > 0
 * @param n2 transmitting medium index [-], real > 0
 * @param thetaRad angle of incidence [rad], in [0, π/2]
 * @returns R_s, R_p [-] and cos θt [-]
 * @throws RangeError for invalid input or when the angle exceeds the critical angle
 * @see Hecht, Optics, 4th ed., §4.6 (from memory)
 */
export function fresnelReflectancesReal(n1: number, n2: number, thetaRad: Radians): RealInterfaceReflectances {
  checkIncidentIndex(n1);
  if (!Number.isFinite(n2) || n2 <= 0) {
    throw new RangeError(`refractive index of the transmitting medium n2 must be finite and > 0; got ${n2}`);
  }
  checkIncidenceAngleRad(thetaRad);
  const cosI = cosIncidence(thetaRad);
  const sin2I = 1 - cosI * cosI; // absolute error ~1e-16, harmless here and saves a Math.sin
  const q2 = n2 * n2 - n1 * n1 * sin2I;
  if (q2 < 0) {
    throw new RangeError(`angle of incidence ${thetaRad} rad exceeds the critical angle for n1=${n1}, n2=${n2}; use fresnelInterface`);
  }
  const kx = n1 * cosI;
  const qx = Math.sqrt(q2);
  if (kx === 0) return { Rs: 1, Rp: 1, cosThetaT: qx / n2 }; // grazing incidence, as in fresnelInterface
  const rs = (kx - qx) / (kx + qx);
  const a = n2 * n2 * kx;
  const b = n1 * n1 * qx;
  const rp = (a - b) / (a + b);
  return { Rs: rs * rs, Rp: rp * rp, cosThetaT: qx / n2 };
}

/**
 * Snell's law, n1 sin θi = n2 sin θt, for real indices.
 * @param n1 incident medium index [-]; @param n2 transmitting medium index [-] (both real > 0)
 * @param thetaRad angle of incidence [rad], in [0, π/2]
 * @returns refraction angle θt [rad], or null beyond the critical angle (no propagating
 *   refracted wave: total internal reflection)
 * @see Hecht, Optics, 4th ed., §4.4 (from memory)
 */
export function snellRefractionAngle(n1: number, n2: number, thetaRad: Radians): Radians | null {
  checkIncidentIndex(n1);
  checkIncidentIndex(n2);
  checkIncidenceAngleRad(thetaRad);
  const s = (n1 / n2) * Math.sin(thetaRad);
  if (s > 1) return null;
  return Math.asin(s) as Radians;
}

/**
 * Brewster's angle, θB = atan(n2/n1), where R_p = 0 (real indices).
 * @param n1 incident medium index [-]; @param n2 transmitting medium index [-] (real > 0)
 * @returns θB [rad]
 * @see Hecht, Optics, 4th ed., §4.6 (section from memory)
 */
export function brewsterAngle(n1: number, n2: number): Radians {
  checkIncidentIndex(n1);
  checkIncidentIndex(n2);
  return Math.atan2(n2, n1) as Radians;
}

/**
 * Critical angle of total internal reflection, θc = asin(n2/n1), defined only for n1 > n2.
 * For θ ≥ θc, R_s = R_p = 1.
 * @param n1 incident medium index [-]; @param n2 transmitting medium index [-] (real > 0)
 * @returns θc [rad], or null when n1 ≤ n2 (no total internal reflection)
 * @see Hecht, Optics, 4th ed., §4.7 (section from memory)
 */
export function criticalAngle(n1: number, n2: number): Radians | null {
  checkIncidentIndex(n1);
  checkIncidentIndex(n2);
  if (n1 <= n2) return null;
  return Math.asin(n2 / n1) as Radians;
}

/** Flux transmitted through an interface and still present at a depth of an absorbing medium [-]. */
export interface TransmittanceAtDepth {
  readonly s: number;
  readonly p: number;
  readonly unpolarized: number;
}

/**
 * Flux that crosses the interface into medium 2 and is still travelling at depth z, ignoring any
 * back face (semi-infinite medium 2). The field varies as exp(i k0 q_x z), so the normal flux
 * decays as exp(−2 k0 Im(q_x) z):
 *   T_j(z) = T_j · exp(−2 k0 Im(q_x) z),  k0 = 2π/λ
 * At normal incidence 2 k0 Im(q_x) = 4πk/λ = α, the Beer–Lambert absorption coefficient.
 * @param n1 incident medium index [-], real > 0
 * @param n2 medium 2 index [-], real or complex (n + ik, k ≥ 0)
 * @param thetaRad angle of incidence [rad], in [0, π/2]
 * @param depthM depth below the interface [m], ≥ 0
 * @param wavelengthM vacuum wavelength [m], > 0
 * @returns s, p and unpolarised flux fractions [-]
 * @see Born & Wolf, Principles of Optics, 7th ed., chapter on the optics of metals (from memory)
 */
export function fresnelTransmittanceAtDepth(
  n1: number,
  n2: RefractiveIndex,
  thetaRad: Radians,
  depthM: number,
  wavelengthM: number,
): TransmittanceAtDepth {
  if (!Number.isFinite(depthM) || depthM < 0) {
    throw new RangeError(`depth must be finite and ≥ 0 m; got ${depthM}`);
  }
  if (!Number.isFinite(wavelengthM) || wavelengthM <= 0) {
    throw new RangeError(`wavelength must be finite and > 0 m; got ${wavelengthM}`);
  }
  const f = fresnelInterface(n1, n2, thetaRad);
  const decay = Math.exp(((-4 * Math.PI) / wavelengthM) * f.qx.im * depthM);
  const s = f.Ts * decay;
  const p = f.Tp * decay;
  return { s, p, unpolarized: 0.5 * (s + p) };
}
