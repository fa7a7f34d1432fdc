import type { Role } from '@beamwright/link-core/contracts';

/**
 * The caller as the JWT strategy puts it on the request; every service method that touches data
 * takes it. Read from the database on each request (the token only names the user and session).
 */
export interface AuthUser {
  userId: string;
  organisationId: string;
  role: Role;
  /** the sign-in session the token belongs to (its `sid` claim) */
  sessionId: string;
}

/** Claims carried by an access token. The role is not among them: it is read per request. */
export interface AccessTokenClaims {
  /** user id */
  sub: string;
  /** organisation id at sign-in (informational; the database decides) */
  org: string;
  /** user_session id */
  sid: string;
}
