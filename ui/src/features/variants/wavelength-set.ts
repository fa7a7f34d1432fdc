// A wavelength set: the same optics at other wavelengths, one alternative each, named by wavelength.
import { USUAL_FSO_WAVELENGTHS_M, type LinkDesignInput } from '@beamwright/link-core';

export const wavelengthLabel = (wavelengthM: number) => `${Number((wavelengthM * 1e9).toPrecision(4))} nm`;

/** The design at each wavelength but its own (to the nanometre), in increasing order. */
export function wavelengthSet(design: LinkDesignInput, wavelengthsM: readonly number[] = USUAL_FSO_WAVELENGTHS_M): { name: string; design: LinkDesignInput }[] {
  const own = Math.round(design.transmitter.wavelengthM * 1e9);
  const distinct = [...new Set(wavelengthsM.map((wavelength) => Math.round(wavelength * 1e9)))].filter((nm) => nm !== own).sort((a, b) => a - b);
  return distinct.map((nm) => ({ name: wavelengthLabel(nm * 1e-9), design: { ...design, transmitter: { ...design.transmitter, wavelengthM: nm * 1e-9 } } }));
}
