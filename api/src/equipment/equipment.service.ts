import { Injectable, NotFoundException } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import { Repository } from 'typeorm';
import {
  ReceiverSpecSchema,
  TransmitterSpecSchema,
  type CreateEquipmentRequestSchema,
  type EquipmentKind,
  type EquipmentResponse,
  type UpdateEquipmentRequestSchema,
} from '@beamwright/link-core/contracts';
import type { z } from 'zod';
import type { AuthUser } from '../common/auth-user.js';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe.js';
import { EquipmentModel } from './equipment-model.entity.js';
import { toEquipmentResponse } from './equipment.mapper.js';

@Injectable()
export class EquipmentService {
  constructor(@InjectRepository(EquipmentModel) private readonly models: Repository<EquipmentModel>) {}

  async list(caller: AuthUser, kind?: EquipmentKind): Promise<EquipmentResponse[]> {
    const rows = await this.models.find({
      where: { organisationId: caller.organisationId, ...(kind ? { kind } : {}) },
      order: { kind: 'ASC', name: 'ASC' },
    });
    return rows.map(toEquipmentResponse);
  }

  async get(caller: AuthUser, id: string): Promise<EquipmentResponse> {
    return toEquipmentResponse(await this.findOwned(caller, id));
  }

  async create(caller: AuthUser, input: z.output<typeof CreateEquipmentRequestSchema>): Promise<EquipmentResponse> {
    const model = await this.models.save(this.models.create({ ...input, organisationId: caller.organisationId, illustrative: false }));
    return toEquipmentResponse(model);
  }

  async update(caller: AuthUser, id: string, changes: z.output<typeof UpdateEquipmentRequestSchema>): Promise<EquipmentResponse> {
    const model = await this.findOwned(caller, id);
    if (changes.spec !== undefined) {
      // the spec must fit the model's kind, which never changes
      const schema = model.kind === 'transmitter' ? TransmitterSpecSchema : ReceiverSpecSchema;
      model.spec = new ZodValidationPipe(schema, 'spec').transform(changes.spec);
    }
    if (changes.name !== undefined) model.name = changes.name;
    if (changes.maker !== undefined) model.maker = changes.maker;
    if (changes.notes !== undefined) model.notes = changes.notes;
    return toEquipmentResponse(await this.models.save(model));
  }

  async remove(caller: AuthUser, id: string): Promise<void> {
    const model = await this.findOwned(caller, id);
    await this.models.delete({ id: model.id, organisationId: caller.organisationId });
  }

  private async findOwned(caller: AuthUser, id: string): Promise<EquipmentModel> {
    const model = await this.models.findOne({ where: { id, organisationId: caller.organisationId } });
    if (!model) throw new NotFoundException('Equipment model not found');
    return model;
  }
}
