import type { EquipmentResponse, ReceiverSpec, TransmitterSpec } from '@beamwright/link-core/contracts';
import type { EquipmentModel } from './equipment-model.entity.js';

export function toEquipmentResponse(model: EquipmentModel): EquipmentResponse {
  const common = {
    id: model.id,
    name: model.name,
    maker: model.maker,
    notes: model.notes,
    illustrative: model.illustrative,
    retiredAt: model.retiredAt ? model.retiredAt.toISOString() : null,
    createdAt: model.createdAt.toISOString(),
    updatedAt: model.updatedAt.toISOString(),
  };
  return model.kind === 'transmitter'
    ? { kind: 'transmitter', ...common, spec: model.spec as TransmitterSpec }
    : { kind: 'receiver', ...common, spec: model.spec as ReceiverSpec };
}
