import { Body, Controller, Delete, Get, Headers, HttpCode, HttpStatus, Param, Post, Query, Res, UploadedFile, UseInterceptors } from '@nestjs/common';
import { FileInterceptor } from '@nestjs/platform-express';
import {
  ApiAcceptedResponse,
  ApiBearerAuth,
  ApiBody,
  ApiConflictResponse,
  ApiConsumes,
  ApiCreatedResponse,
  ApiNoContentResponse,
  ApiOkResponse,
  ApiPayloadTooLargeResponse,
  ApiTags,
  ApiUnprocessableEntityResponse,
  ApiUnsupportedMediaTypeResponse,
} from '@nestjs/swagger';
import type { Response } from 'express';
import {
  WeatherColumnMappingSchema,
  WeatherDatasetListQuerySchema,
  WeatherDatasetListResponseSchema,
  WeatherDatasetSchema,
  WeatherImportJobSchema,
  WeatherImportResultSchema,
  WeatherRowErrorsBodySchema,
  type WeatherDataset,
  type WeatherDatasetListResponse,
  type WeatherImportJob,
  type WeatherImportResult,
} from '@beamwright/link-core/contracts';
import type { z } from 'zod';
import type { AuthUser } from '../common/auth-user.js';
import { CurrentUser } from '../common/decorators/current-user.decorator.js';
import { RolesFor } from '../common/decorators/roles.decorator.js';
import { openApiSchema } from '../common/openapi/zod-openapi.js';
import { uuidParam } from '../common/pipes/uuid-param.pipe.js';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe.js';
import { WeatherDatasetsService } from './weather-datasets.service.js';
import { importStatusUrl } from './weather.mapper.js';
import type { StoredWeatherUpload } from './weather-upload.storage.js';

/** RFC 7240: `Prefer: respond-async` asks for 202 at once instead of waiting for the import. */
function prefersAsync(prefer: string | undefined): boolean {
  return (prefer ?? '')
    .split(',')
    .some((preference) => preference.trim().toLowerCase() === 'respond-async');
}

@ApiTags('weather')
@ApiBearerAuth()
@Controller('weather-datasets')
export class WeatherDatasetsController {
  constructor(private readonly datasets: WeatherDatasetsService) {}

  @Get()
  @ApiOkResponse({ schema: openApiSchema(WeatherDatasetListResponseSchema, 'output') })
  list(@CurrentUser() caller: AuthUser, @Query(new ZodValidationPipe(WeatherDatasetListQuerySchema)) query: z.output<typeof WeatherDatasetListQuerySchema>): Promise<WeatherDatasetListResponse> {
    return this.datasets.list(caller, query.siteId);
  }

  @Post()
  @RolesFor('weather.write')
  @UseInterceptors(FileInterceptor('file'))
  @ApiConsumes('multipart/form-data')
  @ApiBody({
    description:
      'multipart/form-data: `file` (CSV or gzip-compressed CSV, at most 50 MB and 2 000 000 rows; its content decides, not its name), `name`, optional `siteId` and `notes`, `mapping` (the JSON text of the column mapping below) and `onRowErrors` (`reject`, the default: any bad row refuses the file with 422 and nothing is stored; `skip`: the valid rows are imported and the others listed). Timestamps are ISO 8601; one without a zone is read as UTC. The request waits for the import for up to WEATHER_IMPORT_WAIT_SECONDS and answers 201; a longer import, or `Prefer: respond-async`, answers 202 with the job to poll.',
    schema: {
      type: 'object',
      required: ['file', 'name', 'mapping'],
      properties: {
        file: { type: 'string', format: 'binary' },
        name: { type: 'string', maxLength: 200 },
        siteId: { type: 'string', format: 'uuid' },
        notes: { type: 'string', maxLength: 4000 },
        onRowErrors: { type: 'string', enum: ['reject', 'skip'], default: 'reject' },
        mapping: { type: 'string', description: `JSON text of: ${JSON.stringify(openApiSchema(WeatherColumnMappingSchema))}` },
      },
    },
  })
  @ApiCreatedResponse({ schema: openApiSchema(WeatherImportResultSchema, 'output') })
  @ApiAcceptedResponse({ description: 'the import runs on: poll statusUrl (also in Location)', schema: openApiSchema(WeatherImportJobSchema, 'output') })
  @ApiUnprocessableEntityResponse({ description: 'rows could not be read and onRowErrors was reject (or no row could be read); nothing was stored', schema: openApiSchema(WeatherRowErrorsBodySchema, 'output') })
  @ApiPayloadTooLargeResponse({ description: 'the file is over 50 MB, or has more than 2 000 000 rows' })
  @ApiUnsupportedMediaTypeResponse({ description: 'the content is not CSV text (or gzip-compressed CSV text), whatever the file name' })
  async upload(
    @CurrentUser() caller: AuthUser,
    @UploadedFile() file: StoredWeatherUpload | undefined,
    @Body() fields: unknown,
    @Headers('prefer') prefer: string | undefined,
    @Res({ passthrough: true }) response: Response,
  ): Promise<WeatherImportResult | WeatherImportJob> {
    const answer = await this.datasets.createFromUpload(caller, file, fields, prefersAsync(prefer));
    response.status(answer.status);
    if (answer.status === 202) {
      response.setHeader('Location', importStatusUrl(answer.body.jobId));
      response.setHeader('Preference-Applied', 'respond-async');
    }
    return answer.body;
  }

  @Get('imports/:jobId')
  @ApiOkResponse({ schema: openApiSchema(WeatherImportJobSchema, 'output') })
  getImport(@CurrentUser() caller: AuthUser, @Param('jobId', uuidParam('jobId')) jobId: string): Promise<WeatherImportJob> {
    return this.datasets.getImport(caller, jobId);
  }

  @Post('imports/:jobId/cancel')
  @RolesFor('weather.write')
  @HttpCode(HttpStatus.OK)
  @ApiOkResponse({ description: 'the import as it is after the request (cancelled, or still stopping)', schema: openApiSchema(WeatherImportJobSchema, 'output') })
  @ApiConflictResponse({ description: 'the import has already ended' })
  cancelImport(@CurrentUser() caller: AuthUser, @Param('jobId', uuidParam('jobId')) jobId: string): Promise<WeatherImportJob> {
    return this.datasets.cancelImport(caller, jobId);
  }

  @Get(':id')
  @ApiOkResponse({ schema: openApiSchema(WeatherDatasetSchema, 'output') })
  get(@CurrentUser() caller: AuthUser, @Param('id', uuidParam()) id: string): Promise<WeatherDataset> {
    return this.datasets.get(caller, id);
  }

  @Delete(':id')
  @RolesFor('weather.write')
  @HttpCode(HttpStatus.NO_CONTENT)
  @ApiNoContentResponse({ description: 'the data set and its records are deleted' })
  remove(@CurrentUser() caller: AuthUser, @Param('id', uuidParam()) id: string): Promise<void> {
    return this.datasets.remove(caller, id);
  }
}
