import type { GeoPoint } from "../model/types.js";

/** WGS84 semi-major axis in metres and flattening (NIMA TR8350.2). */
export const WGS84_A_M = 6378137;
export const WGS84_F = 1 / 298.257223563;

/**
 * Distance in metres along the WGS84 ellipsoid between two points, by Vincenty's inverse method
 * (T. Vincenty, "Direct and inverse solutions of geodesics on the ellipsoid with application of
 * nested equations", Survey Review 23(176), 1975). Accurate to well under a millimetre for the
 * distances a city network spans; it may fail to converge only for nearly antipodal points,
 * which raises a RangeError. Cost: a few iterations of trigonometry.
 */
export function geodesicDistanceM(from: GeoPoint, to: GeoPoint): number {
  const a = WGS84_A_M;
  const f = WGS84_F;
  const b = (1 - f) * a;
  const rad = Math.PI / 180;
  const L = (to.lon - from.lon) * rad;
  const U1 = Math.atan((1 - f) * Math.tan(from.lat * rad));
  const U2 = Math.atan((1 - f) * Math.tan(to.lat * rad));
  const sinU1 = Math.sin(U1);
  const cosU1 = Math.cos(U1);
  const sinU2 = Math.sin(U2);
  const cosU2 = Math.cos(U2);
  let lambda = L;
  for (let iteration = 0; iteration < 200; iteration++) {
    const sinLambda = Math.sin(lambda);
    const cosLambda = Math.cos(lambda);
    const sinSigma = Math.hypot(cosU2 * sinLambda, cosU1 * sinU2 - sinU1 * cosU2 * cosLambda);
    if (sinSigma === 0) return 0;
    const cosSigma = sinU1 * sinU2 + cosU1 * cosU2 * cosLambda;
    const sigma = Math.atan2(sinSigma, cosSigma);
    const sinAlpha = (cosU1 * cosU2 * sinLambda) / sinSigma;
    const cosSqAlpha = 1 - sinAlpha * sinAlpha;
    // On the equator cos²α is 0 and the midpoint term vanishes.
    const cos2SigmaM = cosSqAlpha !== 0 ? cosSigma - (2 * sinU1 * sinU2) / cosSqAlpha : 0;
    const C = (f / 16) * cosSqAlpha * (4 + f * (4 - 3 * cosSqAlpha));
    const previous = lambda;
    lambda = L + (1 - C) * f * sinAlpha * (sigma + C * sinSigma * (cos2SigmaM + C * cosSigma * (-1 + 2 * cos2SigmaM * cos2SigmaM)));
    if (Math.abs(lambda - previous) < 1e-12) {
      const uSq = (cosSqAlpha * (a * a - b * b)) / (b * b);
      const A = 1 + (uSq / 16384) * (4096 + uSq * (-768 + uSq * (320 - 175 * uSq)));
      const B = (uSq / 1024) * (256 + uSq * (-128 + uSq * (74 - 47 * uSq)));
      const deltaSigma =
        B *
        sinSigma *
        (cos2SigmaM +
          (B / 4) *
            (cosSigma * (-1 + 2 * cos2SigmaM * cos2SigmaM) - (B / 6) * cos2SigmaM * (-3 + 4 * sinSigma * sinSigma) * (-3 + 4 * cos2SigmaM * cos2SigmaM)));
      return b * A * (sigma - deltaSigma);
    }
  }
  throw new RangeError(`geodesic distance did not converge between (${from.lon}, ${from.lat}) and (${to.lon}, ${to.lat}) (nearly antipodal points)`);
}
