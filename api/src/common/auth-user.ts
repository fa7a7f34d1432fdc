import type { Role } from '@beamwright/link-core/contracts';

/** The caller as the JWT strategy puts it on the request; every service method that touches data takes it. */
export interface AuthUser {
  userId: string;
  organisationId: string;
  role: Role;
}

/** Claims carried by an access token. */
export interface AccessTokenClaims {
  sub: string;
  org: string;
  role: Role;
}
