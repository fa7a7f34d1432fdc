import { Body, Controller, Get, HttpCode, HttpStatus, Post } from '@nestjs/common';
import { ApiBearerAuth, ApiBody, ApiOkResponse, ApiTags, ApiUnauthorizedResponse } from '@nestjs/swagger';
import {
  LoginRequestSchema,
  LoginResponseSchema,
  MeResponseSchema,
  type LoginRequest,
  type LoginResponse,
  type MeResponse,
} from '@beamwright/link-core/contracts';
import { Public } from '../common/decorators/public.decorator.js';
import { CurrentUser } from '../common/decorators/current-user.decorator.js';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe.js';
import { openApiSchema } from '../common/openapi/zod-openapi.js';
import type { AuthUser } from '../common/auth-user.js';
import { AuthService } from './auth.service.js';

@ApiTags('auth')
@Controller('auth')
export class AuthController {
  constructor(private readonly auth: AuthService) {}

  @Public()
  @Post('login')
  @HttpCode(HttpStatus.OK)
  @ApiBody({ schema: openApiSchema(LoginRequestSchema) })
  @ApiOkResponse({ schema: openApiSchema(LoginResponseSchema, 'output') })
  @ApiUnauthorizedResponse({ description: 'Unknown e-mail or wrong password (one message for both)' })
  login(@Body(new ZodValidationPipe(LoginRequestSchema)) body: LoginRequest): Promise<LoginResponse> {
    return this.auth.login(body);
  }

  @Get('me')
  @ApiBearerAuth()
  @ApiOkResponse({ schema: openApiSchema(MeResponseSchema, 'output') })
  me(@CurrentUser() caller: AuthUser): Promise<MeResponse> {
    return this.auth.me(caller);
  }
}
