import { SetMetadata } from '@nestjs/common';
import { ApiExtension, ApiOperation } from '@nestjs/swagger';
import { rolesFor, type PermissionAction, type Role } from '@beamwright/link-core/contracts';

export const ROLES_KEY = 'roles';

/**
 * Restricts a route (or a controller) to these roles; without it any signed-in role passes. On a
 * route it also writes the roles into the OpenAPI document: `Roles: …` in the operation's
 * description and the list itself as `x-required-roles`, so a client can read them.
 */
export function Roles(...roles: Role[]): ClassDecorator & MethodDecorator {
  return (target: object, key?: string | symbol, descriptor?: PropertyDescriptor) => {
    SetMetadata(ROLES_KEY, roles)(target, key!, descriptor!);
    if (key !== undefined && descriptor !== undefined) {
      ApiOperation({ description: `Roles: ${roles.join(', ')}` })(target, key, descriptor);
      ApiExtension('x-required-roles', roles)(target, key, descriptor);
    }
  };
}

/** @Roles with the roles the shared rule table (link-core/contracts PERMISSIONS) gives `action`. */
export function RolesFor(action: PermissionAction): ClassDecorator & MethodDecorator {
  return Roles(...rolesFor(action));
}
