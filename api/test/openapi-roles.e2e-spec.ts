import type { INestApplication } from '@nestjs/common';
import { METHOD_METADATA, PATH_METADATA } from '@nestjs/common/constants';
import { MetadataScanner, ModulesContainer, Reflector } from '@nestjs/core';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { rolesFor } from '@beamwright/link-core/contracts';
import { ROLES_KEY } from '../src/common/decorators/roles.decorator.js';
import { createTestApp } from './utils/test-app.js';

const HTTP_METHODS = ['get', 'post', 'put', 'delete', 'patch', 'all', 'options', 'head'];

interface OpenApiOperation {
  description?: string;
  'x-required-roles'?: string[];
}

/** Finding 9 (first half): the OpenAPI document did not say which roles each route needs. */
describe('OpenAPI document: roles per route (e2e)', () => {
  let app: INestApplication;
  let paths: Record<string, Record<string, OpenApiOperation>>;

  beforeAll(async () => {
    app = await createTestApp();
    paths = (await request(app.getHttpServer()).get('/api/docs-json').expect(200)).body.paths;
  });

  afterAll(async () => {
    await app?.close();
  });

  /** Every handler of the app that carries @Roles metadata, with its method and OpenAPI path. */
  function routesWithRoles(): { method: string; path: string; roles: string[] }[] {
    const reflector = app.get(Reflector);
    const scanner = new MetadataScanner();
    const routes: { method: string; path: string; roles: string[] }[] = [];
    const controllers = [...app.get(ModulesContainer).values()].flatMap((module) => [...module.controllers.values()]);
    for (const wrapper of controllers) {
      const prototype = wrapper.metatype?.prototype as Record<string, (...args: unknown[]) => unknown> | undefined;
      if (!prototype) continue;
      const base = String(Reflect.getMetadata(PATH_METADATA, wrapper.metatype!) ?? '');
      for (const name of scanner.getAllMethodNames(prototype)) {
        const handler = prototype[name]!;
        const roles = reflector.getAllAndOverride<string[] | undefined>(ROLES_KEY, [handler, wrapper.metatype!]);
        if (!roles || roles.length === 0) continue;
        const sub = String(Reflect.getMetadata(PATH_METADATA, handler) ?? '');
        const method = HTTP_METHODS[Reflect.getMetadata(METHOD_METADATA, handler) as number]!;
        const path = `/api/${[base, sub].filter((part) => part && part !== '/').join('/')}`.replace(/:(\w+)/g, '{$1}');
        routes.push({ method, path, roles });
      }
    }
    return routes;
  }

  it('lists the roles of every @Roles route as x-required-roles and in the description', () => {
    const routes = routesWithRoles();
    expect(routes.length).toBeGreaterThanOrEqual(15);
    for (const route of routes) {
      const operation = paths[route.path]?.[route.method];
      expect(operation, `${route.method} ${route.path} in the document`).toBeDefined();
      expect(operation!['x-required-roles'], `${route.method} ${route.path}`).toEqual(route.roles);
      expect(operation!.description, `${route.method} ${route.path}`).toContain(`Roles: ${route.roles.join(', ')}`);
    }
  });

  it('names the one role of each review step, from the shared rule table', () => {
    const roles = (path: string, method: string) => paths[path]?.[method]?.['x-required-roles'];
    expect(roles('/api/links/{id}/revisions/{revision}/submit', 'post')).toEqual(['engineer']);
    expect(roles('/api/links/{id}/revisions/{revision}/approve', 'post')).toEqual(['reviewer']);
    expect(roles('/api/links/{id}/revisions/{revision}/return', 'post')).toEqual(['reviewer']);
    expect(roles('/api/links/{id}/revisions/{revision}/install', 'post')).toEqual(['installer']);
    expect(roles('/api/sites', 'post')).toEqual([...rolesFor('site.write')]);
    expect(roles('/api/links/{id}', 'delete')).toEqual([...rolesFor('link.delete')]);
  });
});
