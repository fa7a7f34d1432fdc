import { Body, Controller, Get, Patch } from '@nestjs/common';
import { ApiBearerAuth, ApiBody, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import {
  OrganisationSettingsSchema,
  UpdateOrganisationSettingsRequestSchema,
  type OrganisationSettings,
} from '@beamwright/link-core/contracts';
import type { z } from 'zod';
import type { AuthUser } from '../common/auth-user.js';
import { CurrentUser } from '../common/decorators/current-user.decorator.js';
import { RolesFor } from '../common/decorators/roles.decorator.js';
import { openApiSchema } from '../common/openapi/zod-openapi.js';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe.js';
import { OrganisationSettingsService } from './organisation-settings.service.js';

/** The caller's organisation: its name and the defaults of a new link. Every member reads them. */
@ApiTags('organisation')
@ApiBearerAuth()
@Controller('organisation/settings')
export class OrganisationSettingsController {
  constructor(private readonly settings: OrganisationSettingsService) {}

  @Get()
  @ApiOkResponse({ schema: openApiSchema(OrganisationSettingsSchema, 'output') })
  get(@CurrentUser() caller: AuthUser): Promise<OrganisationSettings> {
    return this.settings.get(caller);
  }

  @Patch()
  @RolesFor('organisation.settings')
  @ApiBody({ schema: openApiSchema(UpdateOrganisationSettingsRequestSchema) })
  @ApiOkResponse({ schema: openApiSchema(OrganisationSettingsSchema, 'output') })
  update(
    @CurrentUser() caller: AuthUser,
    @Body(new ZodValidationPipe(UpdateOrganisationSettingsRequestSchema)) body: z.output<typeof UpdateOrganisationSettingsRequestSchema>,
  ): Promise<OrganisationSettings> {
    return this.settings.update(caller, body);
  }
}
