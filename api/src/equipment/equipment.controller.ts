import { Body, Controller, Delete, Get, HttpCode, HttpStatus, Param, Patch, Post, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiBody, ApiOkResponse, ApiQuery, ApiTags } from '@nestjs/swagger';
import {
  CreateEquipmentRequestSchema,
  EquipmentImportRequestSchema,
  EquipmentImportResultSchema,
  EquipmentListQuerySchema,
  EquipmentListResponseSchema,
  EquipmentResponseSchema,
  UpdateEquipmentRequestSchema,
  type EquipmentImportResult,
  type EquipmentListResponse,
  type EquipmentResponse,
} from '@beamwright/link-core/contracts';
import type { z } from 'zod';
import type { AuthUser } from '../common/auth-user.js';
import { CurrentUser } from '../common/decorators/current-user.decorator.js';
import { RolesFor } from '../common/decorators/roles.decorator.js';
import { openApiSchema } from '../common/openapi/zod-openapi.js';
import { uuidParam } from '../common/pipes/uuid-param.pipe.js';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe.js';
import { EquipmentService } from './equipment.service.js';

@ApiTags('equipment')
@ApiBearerAuth()
@Controller('equipment')
export class EquipmentController {
  constructor(private readonly equipment: EquipmentService) {}

  @Get()
  @ApiQuery({ name: 'kind', required: false, enum: ['transmitter', 'receiver'] })
  @ApiQuery({ name: 'includeRetired', required: false, enum: ['true', 'false'] })
  @ApiOkResponse({ schema: openApiSchema(EquipmentListResponseSchema, 'output') })
  async list(
    @CurrentUser() caller: AuthUser,
    @Query(new ZodValidationPipe(EquipmentListQuerySchema)) query: z.output<typeof EquipmentListQuerySchema>,
  ): Promise<EquipmentListResponse> {
    return { items: await this.equipment.list(caller, query.kind, query.includeRetired === 'true') };
  }

  /** A catalogue CSV: checked, imported whole, or only its valid rows (see EquipmentImportRequestSchema). */
  @Post('import')
  @RolesFor('equipment.write')
  @HttpCode(HttpStatus.OK)
  @ApiBody({ schema: openApiSchema(EquipmentImportRequestSchema) })
  @ApiOkResponse({ schema: openApiSchema(EquipmentImportResultSchema, 'output') })
  importCsv(
    @CurrentUser() caller: AuthUser,
    @Body(new ZodValidationPipe(EquipmentImportRequestSchema)) body: z.output<typeof EquipmentImportRequestSchema>,
  ): Promise<EquipmentImportResult> {
    return this.equipment.importCsv(caller, body.csv, body.mode);
  }

  @Get(':id')
  @ApiOkResponse({ schema: openApiSchema(EquipmentResponseSchema, 'output') })
  get(@CurrentUser() caller: AuthUser, @Param('id', uuidParam()) id: string): Promise<EquipmentResponse> {
    return this.equipment.get(caller, id);
  }

  @Post()
  @RolesFor('equipment.write')
  @ApiBody({ schema: openApiSchema(CreateEquipmentRequestSchema) })
  create(
    @CurrentUser() caller: AuthUser,
    @Body(new ZodValidationPipe(CreateEquipmentRequestSchema)) body: z.output<typeof CreateEquipmentRequestSchema>,
  ): Promise<EquipmentResponse> {
    return this.equipment.create(caller, body);
  }

  @Patch(':id')
  @RolesFor('equipment.write')
  @ApiBody({ schema: openApiSchema(UpdateEquipmentRequestSchema) })
  update(
    @CurrentUser() caller: AuthUser,
    @Param('id', uuidParam()) id: string,
    @Body(new ZodValidationPipe(UpdateEquipmentRequestSchema)) body: z.output<typeof UpdateEquipmentRequestSchema>,
  ): Promise<EquipmentResponse> {
    return this.equipment.update(caller, id, body);
  }

  @Delete(':id')
  @RolesFor('equipment.write')
  @HttpCode(HttpStatus.NO_CONTENT)
  remove(@CurrentUser() caller: AuthUser, @Param('id', uuidParam()) id: string): Promise<void> {
    return this.equipment.remove(caller, id);
  }
}
