import { Body, Controller, HttpCode, HttpStatus, Post } from '@nestjs/common';
import { ApiBearerAuth, ApiBody, ApiOkResponse, ApiTags, ApiUnprocessableEntityResponse } from '@nestjs/swagger';
import { evaluateLink, LinkBudgetSchema, type LinkBudget } from '@beamwright/link-core';
import { EvaluateRequestSchema } from '@beamwright/link-core/contracts';
import type { z } from 'zod';
import { checkedBudget } from '../common/checked-budget.js';
import { openApiSchema } from '../common/openapi/zod-openapi.js';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe.js';

/** Stateless budget evaluation for tools and scripts: nothing is stored. Any signed-in role. */
@ApiTags('evaluate')
@ApiBearerAuth()
@Controller('evaluate')
export class EvaluateController {
  @Post()
  @HttpCode(HttpStatus.OK)
  @ApiBody({ schema: openApiSchema(EvaluateRequestSchema) })
  @ApiOkResponse({ description: "link-core's evaluateLink(design)", schema: openApiSchema(LinkBudgetSchema, 'output') })
  @ApiUnprocessableEntityResponse({ description: 'the computed budget has a non-finite figure (an engine defect); issues name each one' })
  evaluate(@Body(new ZodValidationPipe(EvaluateRequestSchema)) body: z.output<typeof EvaluateRequestSchema>): LinkBudget {
    return checkedBudget(evaluateLink(body.design));
  }
}
