import { Body, Controller, Get, HttpCode, HttpStatus, Param, Post, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiBody, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import {
  ClimatologyAvailabilityRequestSchema,
  ClimatologyAvailabilityResponseSchema,
  RevisionAvailabilityQuerySchema,
  RevisionAvailabilitySchema,
  type ClimatologyAvailabilityResponse,
  type RevisionAvailability,
} from '@beamwright/link-core/contracts';
import type { z } from 'zod';
import type { AuthUser } from '../common/auth-user.js';
import { CurrentUser } from '../common/decorators/current-user.decorator.js';
import { openApiSchema } from '../common/openapi/zod-openapi.js';
import { PositiveIntParamPipe } from '../common/pipes/positive-int-param.pipe.js';
import { uuidParam } from '../common/pipes/uuid-param.pipe.js';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe.js';
import { WeatherAvailabilityService } from './weather-availability.service.js';

/** The availability of a link revision over the weather: a data set's records, or a typed cumulative table. */
@ApiTags('weather')
@ApiBearerAuth()
@Controller('links')
export class WeatherAvailabilityController {
  constructor(private readonly availability: WeatherAvailabilityService) {}

  @Get(':id/revisions/:revision/availability')
  @ApiOkResponse({ schema: openApiSchema(RevisionAvailabilitySchema, 'output') })
  fromRecords(
    @CurrentUser() caller: AuthUser,
    @Param('id', uuidParam()) id: string,
    @Param('revision', new PositiveIntParamPipe('revision')) revision: number,
    @Query(new ZodValidationPipe(RevisionAvailabilityQuerySchema)) query: z.output<typeof RevisionAvailabilityQuerySchema>,
  ): Promise<RevisionAvailability> {
    return this.availability.fromRecords(caller, id, revision, query.datasetId, query.requiredMarginDb, query.variant);
  }

  @Post(':id/revisions/:revision/availability/climatology')
  @HttpCode(HttpStatus.OK)
  @ApiBody({ schema: openApiSchema(ClimatologyAvailabilityRequestSchema) })
  @ApiOkResponse({ schema: openApiSchema(ClimatologyAvailabilityResponseSchema, 'output') })
  fromClimatology(
    @CurrentUser() caller: AuthUser,
    @Param('id', uuidParam()) id: string,
    @Param('revision', new PositiveIntParamPipe('revision')) revision: number,
    @Body(new ZodValidationPipe(ClimatologyAvailabilityRequestSchema)) body: z.output<typeof ClimatologyAvailabilityRequestSchema>,
  ): Promise<ClimatologyAvailabilityResponse> {
    return this.availability.fromClimatology(caller, id, revision, body);
  }
}
