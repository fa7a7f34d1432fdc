/**
 * Labels, methods and sources of the budget terms. Kept apart from the arithmetic so that the hot
 * path only copies references to these constant strings.
 */
import type { BudgetTermKey } from '../schemas/link-budget.schema.js';

export interface TermDescription {
  label: string;
  unit: 'dB' | 'dBm';
  method: string;
  source: string;
}

const ANDREWS_PHILLIPS = 'Andrews L.C., Phillips R.L., "Laser Beam Propagation through Random Media", 2nd ed., SPIE Press (2005)';

/** The atmospheric term when the design uses Al Naboulsi's fog models. */
export const FOG_ATTENUATION_DESCRIPTION: TermDescription = {
  label: 'Atmospheric attenuation (fog, by fog type)',
  unit: 'dB',
  method:
    'β = c(λ)/V with c = 0.11478λ + 3.8367 (advection fog) or 0.18126λ² + 0.13709λ + 3.7502 (radiation fog), λ in µm, V in km; γ = 4.343·β dB/km over the path; stated for 50 m–1 km visibility and 0.69–1.55 µm',
  source: 'Al Naboulsi M., Sizun H., de Fornel F., "Fog attenuation prediction for optical and infrared waves", Opt. Eng. 43(2), 319–329 (2004)',
};

/** The pointing term of an outage-based design (replaces the mean-loss description). */
export const POINTING_OUTAGE_DESCRIPTION: TermDescription = {
  label: 'Pointing error (at the outage probability)',
  unit: 'dB',
  method:
    'Loss −10·log10(c_p/C(0)) with c_p the capture the exact annular capture C(R) = Q1(2R/W, 2b/W) − Q1(2R/W, 2a/W) falls below with the design outage probability, R Rician (bias ν = bias·L, jitter σ = jitter·L per axis); where C falls with the offset, c_p = C(r_p) with Q1(ν/σ, r_p/σ) = p. Negative (a gain) when an offset puts more power on an obscured aperture',
  source: 'Marcum J.I. (1960) Q function; Rice S.O., Bell Syst. Tech. J. 24 (1945); Farid A.A., Hranilovic S., J. Lightwave Technol. 25(7), 1702–1710 (2007) (pointing-error model)',
};

/** The fade margin of the Gaussian-beam turbulence model (replaces the spherical-wave description). */
export const BEAM_WAVE_FADE_DESCRIPTION: TermDescription = {
  label: 'Scintillation fade margin (beam wave)',
  unit: 'dB',
  method:
    'F = −10·log10(I_T/⟨I⟩) with P(I < I_T) = p under a gamma-gamma irradiance; α, β from the aperture-averaged beam-wave log variances: on-axis σ_B² = σ_R²·ratio(Θ, Λ) (hypergeometric form), off-axis 4.42·σ_R²·Λ^(5/6)·(ν² + ⟨r_c²⟩)/W², saturation 0.56(1 + Θ), aperture coefficient between the spherical and plane values linearly in Θ (ours), an obscured aperture as the disc of equal area (ours, conservative). An estimate (±2 dB)',
  source: `${ANDREWS_PHILLIPS}, ch. 8–10 (from memory); Al-Habash M.A., Andrews L.C., Phillips R.L., Opt. Eng. 40(8), 1554–1562 (2001)`,
};

export const TERM_DESCRIPTIONS: Record<BudgetTermKey, TermDescription> = {
  transmitPower: {
    label: 'Transmit power',
    unit: 'dBm',
    method: 'Mean optical output power of the transmitter, as entered',
    source: 'Terminal datasheet (user input)',
  },
  transmitOptics: {
    label: 'Transmit optics and window',
    unit: 'dB',
    method: 'Loss of the transmit optics and window, as entered',
    source: 'Terminal datasheet (user input); 1–3 dB per terminal is common practice',
  },
  geometricSpread: {
    label: 'Geometric spread (beam wider than the receive aperture)',
    unit: 'dB',
    method:
      'Centred Gaussian capture η = exp(−2b²/W²) − exp(−2a²/W²) with W(L) of the launched beam: W² = W0²(1 + L/|F0|)² + (θd·L)², F0 = −W0/√(θ² − θd²), θd = M²λ/(πW0); collimated when θ ≤ θd (W is continuous at that corner, its slope is not)',
    source: `Kogelnik H., Li T., Appl. Opt. 5(10), 1550–1567 (1966); ${ANDREWS_PHILLIPS}, ch. 4 (beam parameters Θ0, Λ0)`,
  },
  turbulenceBeamSpread: {
    label: 'Turbulence beam spread (long-term beam wider than in vacuum)',
    unit: 'dB',
    method:
      '10·log10(C(0; W_LT)/C(0; W)) with C the centred annular capture and W_LT = W·√(1 + T) the long-term radius, beam wander inside it: T the smooth maximum (T_w⁶ + T_s⁶)^(1/6) of the weak 1.33·σ_R²·Λ^(5/6) and strong 1.63·σ_R^(12/5)·Λ forms, Λ of the launched beam at the receiver. 0 for the spherical-wave model or Cn² = 0; a gain where the obscuration is about the size of the beam',
    source: `${ANDREWS_PHILLIPS}, ch. 4 (Λ) and ch. 6 (long-term spread; coefficients from memory, 1.33 checked against our integration of the Kolmogorov-spectrum integral); the joining smooth maximum is ours`,
  },
  atmosphericAttenuation: {
    label: 'Atmospheric attenuation (visibility)',
    unit: 'dB',
    method: 'γ = 4.343·(3.91/V)·(λ/550 nm)^(−q(V)) dB/km over the path, q(V) piecewise as published (a step in the attenuation at V = 50 km for Kim, at 6 and 50 km for Kruse); visibility given as MOR (5 %) is first converted to the 2 % visibility, V2 = (ln 50/ln 20)·MOR = 1.30587·MOR',
    source:
      'Kim I.I., McArthur B., Korevaar E., Proc. SPIE 4214, 26–37 (2001) (q of the Kim model); Kruse P.W. et al., "Elements of Infrared Technology", Wiley (1962) (q of the Kruse model); Koschmieder (1924) and WMO-No. 8 for the 2 %/5 % thresholds',
  },
  pointingLoss: {
    label: 'Pointing error (mean)',
    unit: 'dB',
    method:
      'Mean loss −10·log10(E[C(R)]/C(0)) of the exact annular capture under a Rician radial error: beam and jitter convolve into a Gaussian of per-axis variance W²/4 + σ², so E[C(R)] = Q1(ν/s, b/s) − Q1(ν/s, a/s), s² = W²/4 + σ² (closed form for ν = 0), ν = bias·L, σ = jitter·L per axis. Negative (a gain) when an offset puts more power on an obscured aperture',
    source: 'Marcum J.I. (1960) Q function; Rice S.O., Bell Syst. Tech. J. 24 (1945); convolution derived; model of Farid A.A., Hranilovic S., J. Lightwave Technol. 25(7), 1702–1710 (2007)',
  },

  receiveOptics: {
    label: 'Receive optics and window',
    unit: 'dB',
    method: 'Loss of the receive optics and window, as entered',
    source: 'Terminal datasheet (user input); 1–3 dB per terminal is common practice',
  },
  receiverSensitivity: {
    label: 'Receiver sensitivity (power above the minimum)',
    unit: 'dBm',
    method: 'Minus the sensitivity S: the received power above S is P_rx − S',
    source: 'Terminal datasheet at the link\'s BER target (user input)',
  },
  scintillationFade: {
    label: 'Scintillation fade margin',
    unit: 'dB',
    method:
      'F = −10·log10(I_T/⟨I⟩) with P(I < I_T) = p under a gamma-gamma irradiance; α, β from the aperture-averaged spherical-wave log variances with β0² = 0.50·Cn²·k^(7/6)·L^(11/6) and d² = kD²/(4L); log-normal when α, β > 500. An estimate (±2 dB)',
    source: `Al-Habash M.A., Andrews L.C., Phillips R.L., Opt. Eng. 40(8), 1554–1562 (2001); ${ANDREWS_PHILLIPS}, ch. 8–11`,
  },
  systemAllowance: {
    label: 'System allowance (ageing, window dirt)',
    unit: 'dB',
    method: 'Allowance entered by the engineer',
    source: 'Common practice: 1–3 dB for window dirt and ageing',
  },
};
