import { Body, Controller, Delete, Get, HttpCode, HttpStatus, Param, Patch, Post } from '@nestjs/common';
import { ApiBearerAuth, ApiBody, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import {
  CreateSiteRequestSchema,
  SiteListResponseSchema,
  SiteResponseSchema,
  UpdateSiteRequestSchema,
  type SiteListResponse,
  type SiteResponse,
} from '@beamwright/link-core/contracts';
import type { z } from 'zod';
import type { AuthUser } from '../common/auth-user.js';
import { CurrentUser } from '../common/decorators/current-user.decorator.js';
import { RolesFor } from '../common/decorators/roles.decorator.js';
import { openApiSchema } from '../common/openapi/zod-openapi.js';
import { uuidParam } from '../common/pipes/uuid-param.pipe.js';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe.js';
import { SitesService } from './sites.service.js';

@ApiTags('sites')
@ApiBearerAuth()
@Controller('sites')
export class SitesController {
  constructor(private readonly sites: SitesService) {}

  @Get()
  @ApiOkResponse({ schema: openApiSchema(SiteListResponseSchema, 'output') })
  async list(@CurrentUser() caller: AuthUser): Promise<SiteListResponse> {
    return { items: await this.sites.list(caller) };
  }

  @Get(':id')
  @ApiOkResponse({ schema: openApiSchema(SiteResponseSchema, 'output') })
  get(@CurrentUser() caller: AuthUser, @Param('id', uuidParam()) id: string): Promise<SiteResponse> {
    return this.sites.get(caller, id);
  }

  @Post()
  @RolesFor('site.write')
  @ApiBody({ schema: openApiSchema(CreateSiteRequestSchema) })
  create(
    @CurrentUser() caller: AuthUser,
    @Body(new ZodValidationPipe(CreateSiteRequestSchema)) body: z.output<typeof CreateSiteRequestSchema>,
  ): Promise<SiteResponse> {
    return this.sites.create(caller, body);
  }

  @Patch(':id')
  @RolesFor('site.write')
  @ApiBody({ schema: openApiSchema(UpdateSiteRequestSchema) })
  update(
    @CurrentUser() caller: AuthUser,
    @Param('id', uuidParam()) id: string,
    @Body(new ZodValidationPipe(UpdateSiteRequestSchema)) body: z.output<typeof UpdateSiteRequestSchema>,
  ): Promise<SiteResponse> {
    return this.sites.update(caller, id, body);
  }

  @Delete(':id')
  @RolesFor('site.write')
  @HttpCode(HttpStatus.NO_CONTENT)
  remove(@CurrentUser() caller: AuthUser, @Param('id', uuidParam()) id: string): Promise<void> {
    return this.sites.remove(caller, id);
  }
}
