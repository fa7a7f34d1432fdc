import { Controller, Get } from '@nestjs/common';
import { ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { HealthResponseSchema, type HealthResponse } from '@beamwright/link-core/contracts';
import { Public } from '../common/decorators/public.decorator.js';
import { openApiSchema } from '../common/openapi/zod-openapi.js';
import { HealthService } from './health.service.js';

@ApiTags('health')
@Controller('health')
export class HealthController {
  constructor(private readonly health: HealthService) {}

  /** Always 200 while the process runs; `database` says whether PostgreSQL answers. */
  @Public()
  @Get()
  @ApiOkResponse({ schema: openApiSchema(HealthResponseSchema, 'output') })
  check(): Promise<HealthResponse> {
    return this.health.check();
  }
}
