import { Body, Controller, Get, HttpCode, HttpStatus, Post, Req, UseGuards } from '@nestjs/common';
import {
  ApiBearerAuth,
  ApiBody,
  ApiForbiddenResponse,
  ApiNoContentResponse,
  ApiOkResponse,
  ApiTags,
  ApiTooManyRequestsResponse,
  ApiUnauthorizedResponse,
} from '@nestjs/swagger';
import type { Request } from 'express';
import {
  LoginRequestSchema,
  LoginResponseSchema,
  MeResponseSchema,
  TooManyRequestsBodySchema,
  type LoginRequest,
  type LoginResponse,
  type MeResponse,
} from '@beamwright/link-core/contracts';
import { Public } from '../common/decorators/public.decorator.js';
import { CurrentUser } from '../common/decorators/current-user.decorator.js';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe.js';
import { openApiSchema } from '../common/openapi/zod-openapi.js';
import type { AuthUser } from '../common/auth-user.js';
import { PostgresThrottlerStorage } from '../rate-limits/postgres-throttler.storage.js';
import { AuthService } from './auth.service.js';
import { forgiveSignIn, SignInThrottlerGuard } from './sign-in-throttle.js';

@ApiTags('auth')
@Controller('auth')
export class AuthController {
  constructor(
    private readonly auth: AuthService,
    private readonly throttleStorage: PostgresThrottlerStorage,
  ) {}

  @Public()
  @Post('login')
  @HttpCode(HttpStatus.OK)
  @UseGuards(SignInThrottlerGuard)
  @ApiBody({ schema: openApiSchema(LoginRequestSchema) })
  @ApiOkResponse({ schema: openApiSchema(LoginResponseSchema, 'output') })
  @ApiUnauthorizedResponse({ description: 'Unknown e-mail or wrong password (one message for both)' })
  @ApiForbiddenResponse({ description: 'The right password for a deactivated account' })
  @ApiTooManyRequestsResponse({
    description:
      'Too many sign-in attempts for this account or from this address within the window (settings SIGN_IN_*); the Retry-After header and retryAfterS give the seconds to wait',
    schema: openApiSchema(TooManyRequestsBodySchema, 'output'),
  })
  async login(@Body(new ZodValidationPipe(LoginRequestSchema)) body: LoginRequest, @Req() request: Request): Promise<LoginResponse> {
    const response = await this.auth.login(body);
    await forgiveSignIn(request, this.throttleStorage);
    return response;
  }

  @Post('logout')
  @HttpCode(HttpStatus.NO_CONTENT)
  @ApiBearerAuth()
  @ApiNoContentResponse({ description: 'The session of this token has ended; the token is refused from now on' })
  @ApiUnauthorizedResponse({ description: 'No token, or its session has already ended' })
  async logout(@CurrentUser() caller: AuthUser): Promise<void> {
    await this.auth.logout(caller);
  }

  @Get('me')
  @ApiBearerAuth()
  @ApiOkResponse({ schema: openApiSchema(MeResponseSchema, 'output') })
  me(@CurrentUser() caller: AuthUser): Promise<MeResponse> {
    return this.auth.me(caller);
  }
}
