/**
 * Spherical Bouguer cap (Bullard A + B): the attraction, at a station on its top surface, of a
 * spherical cap of thickness h and arc radius S on a sphere of radius R0, and the curvature
 * correction Bullard B = cap - slab.
 *
 * Conditioning: lambda is the sum of terms of size ~3 alpha (~0.08) that cancel to ~1e-6;
 * against 50-digit arithmetic the float64 result errs by at most ~6e-12 mGal for
 * h = -400 m ... 5000 m, and by ~5e-13 mGal at h = 1 mm, so the printed form is kept as is.
 *
 * Negative heights (station below the datum): the closed form is analytic in h and continuous
 * through h = 0; for h < 0 (R < R0) it equals -(A + 4 pi G rho (R0^3 - R^3) / (3 R^2)), where
 * A is the downward attraction at the station of a layer of density rho filling the cap
 * between the station and the datum (verified by quadrature to 1e-12). The second term is the
 * jump of the attraction across each spherical sheet; the flat analogue is what makes the slab
 * 2 pi G rho h negative below the datum. Bullard B = cap - slab is about -0.643 mGal at
 * h = -400 m (rho = 2670), so subtracting the cap there adds 45.43 mGal.
 */
import { CAP_RADIUS_M, EARTH_RADIUS_M, G } from '../constants.js';
import { bouguerSlab } from './bouguer-slab.js';

/**
 * Attraction of the spherical cap, m/s^2, at a station `heightM` (m) above the sphere of radius
 * EARTH_RADIUS_M, cap density `densityKgM3` (kg/m^3), cap arc radius `capRadiusM` (m, measured
 * on the R0 sphere; default 166.735 km, Hayford-Bowie zone O). [LaFehr1991] closed form as
 * printed in [Hinze2005]. Returns 0 at h = 0; NaN inputs give NaN.
 */
export function bouguerCap(heightM: number, densityKgM3: number, capRadiusM: number = CAP_RADIUS_M): number {
  const r0 = EARTH_RADIUS_M;
  const radius = r0 + heightM; // R = R0 + h
  const eta = heightM / radius;
  const alpha = capRadiusM / r0;
  const delta = r0 / radius;

  const cosA = Math.cos(alpha);
  const sinA = Math.sin(alpha);
  const sinHalf = Math.sin(alpha / 2);
  // [LaFehr1991] auxiliary constants of the cap
  const d = 3 * cosA * cosA - 2;
  const f = cosA;
  const k = sinA * sinA;
  const p = -6 * cosA * cosA * sinHalf + 4 * sinHalf * sinHalf * sinHalf;
  const m = -3 * sinA * sinA * cosA;
  const n = 2 * (sinHalf - sinHalf * sinHalf);

  const fd = f - delta;
  const root = Math.sqrt(fd * fd + k);
  // [LaFehr1991] lambda
  const lambda = ((d + f * delta + delta * delta) * root + p + m * Math.log(n / (fd + root))) / 3;
  const mu = 1 + (eta * eta) / 3 - eta;
  // [LaFehr1991] BC_cap = 2 pi G rho (mu h - lambda R)
  return 2 * Math.PI * G * densityKgM3 * (mu * heightM - lambda * radius);
}

/**
 * Bullard B curvature correction, m/s^2: bouguerCap - bouguerSlab for the default cap radius
 * ([LaFehr1991]; [Whitman1991] reports up to about 1.5 mGal in high mountains).
 */
export function bullardB(heightM: number, densityKgM3: number): number {
  return bouguerCap(heightM, densityKgM3) - bouguerSlab(heightM, densityKgM3);
}
