import { Injectable, NotFoundException, UnprocessableEntityException } from '@nestjs/common';
import { InjectDataSource, InjectRepository } from '@nestjs/typeorm';
import { DataSource, IsNull, Repository } from 'typeorm';
import {
  type EquipmentImportMode,
  type EquipmentImportResult,
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
import { readCatalogueCsv } from './equipment-import.js';

@Injectable()
export class EquipmentService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @InjectRepository(EquipmentModel) private readonly models: Repository<EquipmentModel>,
  ) {}

  /** The models in service (and the retired ones too with `includeRetired`, for the catalogue screen). */
  async list(caller: AuthUser, kind?: EquipmentKind, includeRetired = false): Promise<EquipmentResponse[]> {
    const rows = await this.models.find({
      where: { organisationId: caller.organisationId, ...(kind ? { kind } : {}), ...(includeRetired ? {} : { retiredAt: IsNull() }) },
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
    // retiring keeps the first date; a model put back in service loses it
    if (changes.retired === true) model.retiredAt ??= new Date();
    if (changes.retired === false) model.retiredAt = null;
    return toEquipmentResponse(await this.models.save(model));
  }

  /**
   * Imports a catalogue CSV in one transaction. `check` only reports; `all-or-nothing` refuses the
   * whole file (422, nothing written) when any row is wrong; `valid-rows` writes the rows that are right.
   */
  async importCsv(caller: AuthUser, csv: string, mode: EquipmentImportMode): Promise<EquipmentImportResult> {
    const read = readCatalogueCsv(csv);
    const report = { mode, totalRows: read.totalRows, validRows: read.valid.length, errors: read.errors };
    if (mode === 'check') return { ...report, imported: 0, items: [] };
    if (mode === 'all-or-nothing' && read.errors.length > 0) {
      throw new UnprocessableEntityException({
        message: `Nothing was imported: ${read.errors.length} problem${read.errors.length === 1 ? '' : 's'} in the file. Fix them, or import only the ${read.valid.length} valid row${read.valid.length === 1 ? '' : 's'}.`,
        ...report,
        imported: 0,
        items: [],
      });
    }
    const saved = await this.dataSource.transaction((manager) =>
      manager.save(read.valid.map((input) => manager.create(EquipmentModel, { ...input, organisationId: caller.organisationId, illustrative: false }))),
    );
    return { ...report, imported: saved.length, items: saved.map(toEquipmentResponse) };
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
