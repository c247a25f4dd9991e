/** Small display helpers shared by pages and islands (pure). */

const POINTS = ["N", "NNE", "NE", "ENE", "E", "ESE", "SE", "SSE", "S", "SSW", "SW", "WSW", "W", "WNW", "NW", "NNW"] as const;

/** 16-point compass name of an azimuth in degrees clockwise from north. */
export function compassPoint(azimuthDeg: number): string {
  const a = ((azimuthDeg % 360) + 360) % 360;
  return POINTS[Math.round(a / 22.5) % 16]!;
}
