/**
 * A longitude difference in degrees brought into [-180, 180): the short way round, so a step from
 * 179.9° E to 179.9° W is +0.2°, across the antimeridian, not -359.8°.
 * @example wrapLongitude(-359.8) → 0.2 (up to rounding)
 */
export function wrapLongitude(deltaDeg: number): number {
  return deltaDeg - 360 * Math.floor((deltaDeg + 180) / 360);
}
