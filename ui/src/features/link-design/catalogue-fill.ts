// Filling the form from a catalogue model: the datasheet's values in the fields, with the
// datasheet's own width and angle definitions kept (the engine converts them to 1/e² radii).
import type { ReceiverSpec, TransmitterSpec } from '@beamwright/link-core/contracts';
import { QUANTITY_FIELDS, type QuantityFieldId } from '@/features/link-design/design-fields';
import { writeQuantity, type DesignDraft } from '@/features/link-design/design-draft';

/** Fills the transmitter fields from a catalogue model, keeping the datasheet's own definitions. */
export function applyTransmitterSpec(draft: DesignDraft, spec: TransmitterSpec): DesignDraft {
  const text = { ...draft.text };
  const write = (id: QuantityFieldId, value: number | undefined) => {
    text[id] = value === undefined ? '' : writeQuantity(QUANTITY_FIELDS[id], value);
  };
  write('transmitter.wavelengthM', spec.wavelengthM);
  write('transmitter.powerDbm', spec.powerDbm);
  write('transmitter.m2', spec.m2 ?? 1);
  write('transmitter.opticsLossDb', spec.opticsLossDb);
  let beamSize: DesignDraft['beamSize'];
  if (spec.beamSize.kind === 'waist-radius') {
    write('transmitter.waistRadiusM', spec.beamSize.waistRadiusM);
    beamSize = { extent: 'radius', definition: '1/e2' };
  } else {
    write('transmitter.waistRadiusM', spec.beamSize.diameterM);
    beamSize = { extent: 'diameter', definition: spec.beamSize.definition };
  }
  let divergence = draft.divergence;
  if (spec.divergence) {
    write('transmitter.halfAngleDivergenceRad', spec.divergence.angleRad);
    divergence = { extent: spec.divergence.angle, definition: spec.divergence.definition };
  } else {
    write('transmitter.halfAngleDivergenceRad', undefined);
  }
  return { ...draft, text, beamSize, divergence };
}

/** Fills the receiver fields from a catalogue model. */
export function applyReceiverSpec(draft: DesignDraft, spec: ReceiverSpec): DesignDraft {
  const text = { ...draft.text };
  const write = (id: QuantityFieldId, value: number | undefined) => {
    text[id] = value === undefined ? '' : writeQuantity(QUANTITY_FIELDS[id], value);
  };
  write('receiver.apertureDiameterM', spec.apertureDiameterM);
  write('receiver.obscurationRatio', spec.obscurationRatio ?? 0);
  write('receiver.opticsLossDb', spec.opticsLossDb);
  write('receiver.sensitivityDbm', spec.sensitivityDbm);
  write('receiver.overloadDbm', spec.overloadDbm);
  write('receiver.fieldOfViewRad', spec.fieldOfViewRad);
  return { ...draft, text };
}
