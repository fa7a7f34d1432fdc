import { Controller, ForbiddenException, Get, type ExecutionContext } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import { Test } from '@nestjs/testing';
import { describe, expect, it } from 'vitest';
import type { Role } from '@beamwright/link-core/contracts';
import { Public } from '../decorators/public.decorator.js';
import { Roles } from '../decorators/roles.decorator.js';
import { RolesGuard } from './roles.guard.js';

@Roles('admin', 'engineer')
@Controller()
class SampleController {
  @Get() write() {}
  @Roles('reviewer') @Get('review') review() {}
  @Public() @Get('open') open() {}
}

@Controller()
class UnrestrictedController {
  @Get() read() {}
}

function contextFor(controller: object, handler: (...args: never[]) => unknown, role?: Role): ExecutionContext {
  return {
    getHandler: () => handler,
    getClass: () => controller,
    switchToHttp: () => ({ getRequest: () => ({ user: role ? { userId: 'u', organisationId: 'o', role } : undefined }) }),
  } as unknown as ExecutionContext;
}

describe('RolesGuard', () => {
  async function guard() {
    const moduleRef = await Test.createTestingModule({ providers: [RolesGuard, Reflector] }).compile();
    return moduleRef.get(RolesGuard);
  }

  it('lets a role listed on the controller through and stops the others with 403', async () => {
    const rolesGuard = await guard();
    const write = SampleController.prototype.write;
    expect(rolesGuard.canActivate(contextFor(SampleController, write, 'engineer'))).toBe(true);
    expect(rolesGuard.canActivate(contextFor(SampleController, write, 'admin'))).toBe(true);
    expect(() => rolesGuard.canActivate(contextFor(SampleController, write, 'installer'))).toThrow(ForbiddenException);
  });

  it('lets a handler-level @Roles override the controller (getAllAndOverride)', async () => {
    const rolesGuard = await guard();
    const review = SampleController.prototype.review;
    expect(rolesGuard.canActivate(contextFor(SampleController, review, 'reviewer'))).toBe(true);
    expect(() => rolesGuard.canActivate(contextFor(SampleController, review, 'engineer'))).toThrow(ForbiddenException);
  });

  it('lets any signed-in role through where no roles are required, and public routes without a user', async () => {
    const rolesGuard = await guard();
    expect(rolesGuard.canActivate(contextFor(UnrestrictedController, UnrestrictedController.prototype.read, 'installer'))).toBe(true);
    expect(rolesGuard.canActivate(contextFor(SampleController, SampleController.prototype.open))).toBe(true);
  });
});
