/**
 * Solar irradiance for a site and its transposition onto a tilted or vertical surface: what the
 * rest of the app uses. One file per model:
 * - extraterrestrial.ts: E0 (Spencer 1971; simple cosine form; ASHRAE form)
 * - air-mass.ts: relative air mass (Kasten & Young 1989), absolute air mass, pressure from elevation
 * - clear-sky-ineichen-perez2002.ts, clear-sky-ashrae-tau2009.ts: clear-sky irradiance
 * - transposition-surface.ts: per-surface constants and the per-surface-hour hot path
 * - isotropic-liu-jordan1960.ts, hay-davies1980.ts, perez1990.ts: sky-diffuse models
 * - transposition.ts: the sky-model dispatcher and the total on a tilted surface
 * - ground-reflection.ts: isotropic ground reflection
 */
export * from "./extraterrestrial";
export * from "./air-mass";
export * from "./clear-sky-ineichen-perez2002";
export * from "./clear-sky-ashrae-tau2009";
export * from "./transposition-surface";
export * from "./ground-reflection";
export * from "./isotropic-liu-jordan1960";
export * from "./hay-davies1980";
export * from "./perez1990";
export * from "./transposition";
