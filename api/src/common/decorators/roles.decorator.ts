import { SetMetadata } from '@nestjs/common';
import type { Role } from '@beamwright/link-core/contracts';

export const ROLES_KEY = 'roles';
/** Restricts a route (or a controller) to these roles; without it any signed-in role passes. */
export const Roles = (...roles: Role[]) => SetMetadata(ROLES_KEY, roles);

/** Roles that may create and change designs, sites and equipment. */
export const DESIGN_WRITERS: Role[] = ['admin', 'engineer'];
/** Roles that may approve or return a revision. */
export const REVIEWERS: Role[] = ['admin', 'reviewer'];
