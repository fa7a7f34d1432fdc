/**
 * Propagation of an ideal or M² ("embedded Gaussian") beam from its waist.
 *
 * Widths are 1/e² intensity radii; angles are 1/e² half-angles; z is the distance from the waist
 * (negative before it). Wavelengths are vacuum wavelengths; a refractive index n shortens the
 * wavelength in the medium to λ/n.
 */

/** Input of {@link gaussianBeam}. */
export interface GaussianBeamInput {
  /** Vacuum wavelength [m], > 0 (FSO: 7.85e-7 … 1.55e-6). */
  wavelengthM: number;
  /** Waist radius w0, 1/e² intensity (second-moment for M² > 1) [m], > 0. */
  waistRadiusM: number;
  /** Beam quality factor M² ≥ 1 (default 1). */
  m2?: number;
  /** Refractive index of the medium, > 0 (default 1; air ≈ 1.0003). */
  refractiveIndex?: number;
}

/** A propagating Gaussian beam: constants plus functions of the distance z from the waist [m]. */
export interface GaussianBeam {
  wavelengthM: number;
  waistRadiusM: number;
  m2: number;
  refractiveIndex: number;
  /** z_R = π w0² n / (M² λ) [m]. */
  rayleighRangeM: number;
  /** Confocal parameter b = 2 z_R [m]. */
  confocalParameterM: number;
  /** Far-field half-angle θ = M² λ / (π n w0) [rad] (1/e²). */
  halfAngleDivergenceRad: number;
  /** Full angle 2θ [rad]. */
  fullAngleDivergenceRad: number;
  /** Beam parameter product w0·θ = M² λ/(π n) [m·rad]. */
  beamParameterProductMRad: number;
  /** w(z) = w0·sqrt(1 + (z/z_R)²) [m]; even in z, ≥ w0. */
  radiusAtM(zM: number): number;
  /** R(z) = z·(1 + (z_R/z)²) [m]; Infinity at z = 0, negative for z < 0. */
  wavefrontRadiusAtM(zM: number): number;
  /** Gouy phase ψ(z) = atan(z/z_R) [rad], in (−π/2, π/2). */
  gouyPhaseAtRad(zM: number): number;
  /** Far-field asymptote θ·|z| [m] (a good approximation of w(z) only for |z| ≫ z_R). */
  farFieldRadiusAtM(zM: number): number;
}

function requirePositive(value: number | undefined, field: string): void {
  if (typeof value !== 'number' || !Number.isFinite(value) || value <= 0) {
    throw new RangeError(`${field} must be a finite number > 0 (got ${String(value)})`);
  }
}

/**
 * Rayleigh range of an (embedded) Gaussian beam. Plain-number form for hot loops: no validation.
 *
 * @param wavelengthM vacuum wavelength [m], > 0
 * @param waistRadiusM waist radius w0 (1/e²) [m], > 0
 * @param m2 beam quality factor M² ≥ 1 (default 1)
 * @param refractiveIndex refractive index n > 0 (default 1)
 * @returns z_R = π w0² n / (M² λ) [m]
 * @see Kogelnik H., Li T., "Laser beams and resonators", Appl. Opt. 5(10), 1550–1567 (1966), eq. 17;
 *   Siegman A.E., "Lasers" (1986), eq. 17.21; ISO 11146-1:2021 (M² scaling).
 */
export function rayleighRangeM(wavelengthM: number, waistRadiusM: number, m2 = 1, refractiveIndex = 1): number {
  return (Math.PI * waistRadiusM * waistRadiusM * refractiveIndex) / (m2 * wavelengthM);
}

/**
 * Far-field half-angle divergence of an (embedded) Gaussian beam waist: θ = M² λ / (π n w0).
 * Plain-number form, no validation.
 *
 * @param wavelengthM vacuum wavelength [m], > 0
 * @param waistRadiusM waist radius w0 (1/e²) [m], > 0
 * @param m2 M² ≥ 1 (default 1)
 * @param refractiveIndex n > 0 (default 1)
 * @returns half-angle [rad], 1/e²
 * @see Siegman A.E., "Lasers" (1986), eq. 17.27; Kogelnik & Li (1966).
 */
export function diffractionHalfAngleRad(wavelengthM: number, waistRadiusM: number, m2 = 1, refractiveIndex = 1): number {
  return (m2 * wavelengthM) / (Math.PI * refractiveIndex * waistRadiusM);
}

/**
 * Beam radius at distance z from the waist: w(z) = w0·sqrt(1 + (z/z_R)²). Plain-number form.
 *
 * @param waistRadiusM w0 [m], > 0
 * @param rayleighRangeMeters z_R [m], > 0
 * @param zM distance from the waist [m], any real
 * @returns w(z) [m], ≥ w0
 * @see Kogelnik & Li (1966), eq. 17; Siegman (1986), eq. 17.21.
 */
export function beamRadiusFromWaistM(waistRadiusM: number, rayleighRangeMeters: number, zM: number): number {
  const ratio = zM / rayleighRangeMeters;
  return waistRadiusM * Math.sqrt(1 + ratio * ratio);
}

/**
 * Wavefront radius of curvature R(z) = z·(1 + (z_R/z)²). Plain-number form.
 *
 * @param rayleighRangeMeters z_R [m], > 0
 * @param zM distance from the waist [m]
 * @returns R(z) [m]; Infinity at z = 0; sign of z; |R| is smallest (2 z_R) at |z| = z_R
 * @see Kogelnik & Li (1966), eq. 18; Siegman (1986), eq. 17.22.
 */
export function wavefrontRadiusFromWaistM(rayleighRangeMeters: number, zM: number): number {
  if (zM === 0) return Infinity;
  const ratio = rayleighRangeMeters / zM;
  return zM * (1 + ratio * ratio);
}

/**
 * Gouy phase ψ(z) = atan(z/z_R).
 *
 * @param rayleighRangeMeters z_R [m], > 0
 * @param zM distance from the waist [m]
 * @returns ψ [rad] in (−π/2, π/2)
 * @see Siegman (1986), eq. 17.23.
 */
export function gouyPhaseRad(rayleighRangeMeters: number, zM: number): number {
  return Math.atan(zM / rayleighRangeMeters);
}

/**
 * Describes a Gaussian (or M² embedded-Gaussian) beam from its waist: Rayleigh range, divergence
 * and the radius, wavefront curvature and Gouy phase at any distance z from the waist.
 *
 * @param input wavelength [m] > 0, waist radius (1/e²) [m] > 0, M² ≥ 1, refractive index > 0
 * @returns the beam description (all lengths in m, angles in rad)
 * @throws RangeError naming the field when an input is not finite or out of range
 * @see Kogelnik H., Li T., "Laser beams and resonators", Appl. Opt. 5(10), 1550–1567 (1966);
 *   Siegman A.E., "Lasers", University Science Books (1986), ch. 17, eqs. 17.21–17.27;
 *   ISO 11146-1:2021 for second-moment widths and M².
 */
export function gaussianBeam(input: GaussianBeamInput): GaussianBeam {
  const { wavelengthM, waistRadiusM } = input;
  const m2 = input.m2 ?? 1;
  const refractiveIndex = input.refractiveIndex ?? 1;
  requirePositive(wavelengthM, 'wavelengthM');
  requirePositive(waistRadiusM, 'waistRadiusM');
  requirePositive(refractiveIndex, 'refractiveIndex');
  if (!Number.isFinite(m2) || m2 < 1) throw new RangeError(`m2 must be a finite number ≥ 1 (got ${String(m2)})`);
  const zR = rayleighRangeM(wavelengthM, waistRadiusM, m2, refractiveIndex);
  const theta = diffractionHalfAngleRad(wavelengthM, waistRadiusM, m2, refractiveIndex);
  return {
    wavelengthM,
    waistRadiusM,
    m2,
    refractiveIndex,
    rayleighRangeM: zR,
    confocalParameterM: 2 * zR,
    halfAngleDivergenceRad: theta,
    fullAngleDivergenceRad: 2 * theta,
    beamParameterProductMRad: waistRadiusM * theta,
    radiusAtM: (zM: number) => beamRadiusFromWaistM(waistRadiusM, zR, zM),
    wavefrontRadiusAtM: (zM: number) => wavefrontRadiusFromWaistM(zR, zM),
    gouyPhaseAtRad: (zM: number) => gouyPhaseRad(zR, zM),
    farFieldRadiusAtM: (zM: number) => theta * Math.abs(zM),
  };
}
