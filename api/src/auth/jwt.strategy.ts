import { Inject, Injectable, UnauthorizedException } from '@nestjs/common';
import { PassportStrategy } from '@nestjs/passport';
import { ExtractJwt, Strategy } from 'passport-jwt';
import { z } from 'zod';
import { authConfig, type AuthConfig } from '../config/auth.config.js';
import type { AccessTokenClaims, AuthUser } from '../common/auth-user.js';
import { SessionsService } from './sessions.service.js';

export const SESSION_ENDED_MESSAGE = 'Your session has ended; sign in again';

// Tokens are only minted by AuthService; a token without these claims is not ours (or predates sessions).
const ClaimsSchema = z.object({ sub: z.uuid(), sid: z.uuid() });

@Injectable()
export class JwtStrategy extends PassportStrategy(Strategy) {
  constructor(
    @Inject(authConfig.KEY) config: AuthConfig,
    private readonly sessions: SessionsService,
  ) {
    super({
      jwtFromRequest: ExtractJwt.fromAuthHeaderAsBearerToken(),
      ignoreExpiration: false,
      secretOrKey: config.jwtSecret,
      algorithms: ['HS256'],
    });
  }

  /**
   * Runs after the signature and expiry checks, on every signed-in request: the token stands only
   * while its session is live and its user exists and is active; role and organisation are the
   * database's current ones.
   */
  async validate(claims: Partial<AccessTokenClaims>): Promise<AuthUser> {
    const parsed = ClaimsSchema.safeParse(claims);
    if (!parsed.success) throw new UnauthorizedException(SESSION_ENDED_MESSAGE);
    const caller = await this.sessions.findCaller(parsed.data.sid, parsed.data.sub);
    if (!caller) throw new UnauthorizedException(SESSION_ENDED_MESSAGE);
    return caller;
  }
}
