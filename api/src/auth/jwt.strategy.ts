import { Inject, Injectable } from '@nestjs/common';
import { PassportStrategy } from '@nestjs/passport';
import { ExtractJwt, Strategy } from 'passport-jwt';
import { ROLES } from '@beamwright/link-core/contracts';
import { authConfig, type AuthConfig } from '../config/auth.config.js';
import type { AccessTokenClaims, AuthUser } from '../common/auth-user.js';

@Injectable()
export class JwtStrategy extends PassportStrategy(Strategy) {
  constructor(@Inject(authConfig.KEY) config: AuthConfig) {
    super({
      jwtFromRequest: ExtractJwt.fromAuthHeaderAsBearerToken(),
      ignoreExpiration: false,
      secretOrKey: config.jwtSecret,
      algorithms: ['HS256'],
    });
  }

  validate(claims: Partial<AccessTokenClaims>): AuthUser | false {
    // Tokens are only minted by AuthService; a token without these claims is not ours.
    if (!claims.sub || !claims.org || !claims.role || !ROLES.includes(claims.role)) return false;
    return { userId: claims.sub, organisationId: claims.org, role: claims.role };
  }
}
