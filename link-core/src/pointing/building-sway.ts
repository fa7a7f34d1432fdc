/**
 * Order-of-magnitude estimates of building motion that steers a rooftop terminal: fundamental
 * frequency, wind tilt and thermal tilt. Estimates for defaults and warnings, not structural analysis:
 * mounts and wind loads are for a qualified structural engineer to approve.
 */

/**
 * Fundamental flexural frequency of a building from its height, n1 ≈ 46/h.
 * Intended for h > 50 m; real buildings scatter by ±30 % or more.
 *
 * @param buildingHeightM h [m], > 0
 * @returns n1 [Hz] (0.23 Hz at 200 m)
 * @see EN 1991-1-4:2005, Eurocode 1: Actions on structures — Wind actions, Annex F, eq. F.2
 *   (equation recalled from memory, not verified).
 */
export function buildingFundamentalFrequencyHz(buildingHeightM: number): number {
  if (!(buildingHeightM > 0) || !Number.isFinite(buildingHeightM)) throw new RangeError('buildingHeightM must be a finite number > 0');
  return 46 / buildingHeightM;
}

/** Input of {@link buildingTiltEstimates}. */
export interface BuildingTiltInput {
  /** Top drift over height Δ/H under the wind considered (H/500 ≈ 0.002 is a typical serviceability limit). */
  driftRatio: number;
  /** Building height H [m], > 0. */
  heightM: number;
  /** Building width B across the temperature gradient [m], > 0. */
  widthM: number;
  /** Linear thermal expansion coefficient α_T [1/K] (concrete/steel ≈ 1e-5). */
  thermalExpansionPerK: number;
  /** Temperature difference between opposite faces ΔT [K]. */
  temperatureDifferenceK: number;
  /** Link range [m], ≥ 0, to express a tilt as a displacement at the far end. */
  rangeM: number;
}

/** Result of {@link buildingTiltEstimates}. */
export interface BuildingTiltEstimates {
  /** Top rotation of a uniformly loaded flexural cantilever, (4/3)·Δ/H [rad]. */
  flexuralCantileverTiltRad: number;
  /** Top rotation of a shear-type frame, ≈ Δ/H [rad]. */
  shearFrameTiltRad: number;
  /** Top rotation from thermal bowing, α_T·ΔT·H/B [rad]. */
  thermalBowingTiltRad: number;
  /** Top lateral displacement from thermal bowing, α_T·ΔT·H²/(2B) [m]. */
  thermalBowingTopDisplacementM: number;
  /** Beam displacement at the far end from the thermal tilt, tilt·L [m]. */
  thermalBeamDisplacementAtRangeM: number;
}

/**
 * Tilt of a building top under wind drift and a temperature difference between faces.
 *
 * @param input see {@link BuildingTiltInput}
 * @returns tilts [rad] and displacements [m]
 * @see common practice; elementary beam theory (uniform-load cantilever tip rotation = (4/3)·tip
 *   drift/H; curvature α_T·ΔT/B for a linear gradient), e.g. Timoshenko S.P., Gere J.M.,
 *   "Mechanics of Materials" (cantilever deflection tables).
 */
export function buildingTiltEstimates(input: BuildingTiltInput): BuildingTiltEstimates {
  const curvature = (input.thermalExpansionPerK * input.temperatureDifferenceK) / input.widthM;
  const thermalTilt = curvature * input.heightM;
  return {
    flexuralCantileverTiltRad: (4 / 3) * input.driftRatio,
    shearFrameTiltRad: input.driftRatio,
    thermalBowingTiltRad: thermalTilt,
    thermalBowingTopDisplacementM: (curvature * input.heightM * input.heightM) / 2,
    thermalBeamDisplacementAtRangeM: thermalTilt * input.rangeM,
  };
}
