import { ForbiddenException, Inject, Injectable, NotFoundException, UnauthorizedException } from '@nestjs/common';
import { JwtService } from '@nestjs/jwt';
import type { LoginRequest, LoginResponse, MeResponse } from '@beamwright/link-core/contracts';
import { authConfig, type AuthConfig } from '../config/auth.config.js';
import type { AccessTokenClaims, AuthUser } from '../common/auth-user.js';
import { UsersService } from '../users/users.service.js';
import { hashPassword, verifyPassword } from '../users/password-hasher.js';
import { SessionsService } from './sessions.service.js';

/** One message for unknown e-mail and wrong password, so sign-in does not reveal who has an account. */
export const BAD_CREDENTIALS_MESSAGE = 'E-mail or password is incorrect';
/** Only said after the right password, so it tells nothing to someone guessing. */
export const DEACTIVATED_MESSAGE = 'This account has been deactivated. Ask an administrator of your organisation.';

@Injectable()
export class AuthService {
  // Verified against when the e-mail is unknown, so both failures take about as long.
  private readonly dummyHash = hashPassword('not-a-real-password-only-for-timing');

  constructor(
    private readonly users: UsersService,
    private readonly sessions: SessionsService,
    private readonly jwt: JwtService,
    @Inject(authConfig.KEY) private readonly config: AuthConfig,
  ) {}

  async login(request: LoginRequest): Promise<LoginResponse> {
    const user = await this.users.findByEmail(request.email);
    const valid = await verifyPassword(user?.passwordHash ?? (await this.dummyHash), request.password);
    if (!user || !valid) throw new UnauthorizedException(BAD_CREDENTIALS_MESSAGE);
    if (user.deactivatedAt) throw new ForbiddenException(DEACTIVATED_MESSAGE);
    const expiresInS = this.config.jwtExpiresInS;
    const session = await this.sessions.start(user.id, new Date(Date.now() + expiresInS * 1000));
    const claims: AccessTokenClaims = { sub: user.id, org: user.organisationId, sid: session.id };
    const accessToken = await this.jwt.signAsync(claims, { expiresIn: expiresInS });
    return { accessToken, expiresInS };
  }

  /** Ends the caller's session: the token is refused from the next request on. */
  async logout(caller: AuthUser): Promise<void> {
    await this.sessions.revoke(caller.sessionId);
  }

  async me(caller: AuthUser): Promise<MeResponse> {
    const user = await this.users.findInOrganisation(caller.organisationId, caller.userId);
    if (!user?.organisation) throw new NotFoundException('The signed-in user no longer exists');
    return {
      user: { id: user.id, email: user.email, displayName: user.displayName },
      organisation: { id: user.organisation.id, name: user.organisation.name },
      role: user.role,
    };
  }
}
