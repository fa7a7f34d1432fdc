import { ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource, InjectRepository } from '@nestjs/typeorm';
import { DataSource, In, Repository, type EntityManager } from 'typeorm';
import type { CreateSiteRequestSchema, SiteResponse, UpdateSiteRequestSchema } from '@beamwright/link-core/contracts';
import type { z } from 'zod';
import type { AuthUser } from '../common/auth-user.js';
import { FOREIGN_KEY_VIOLATION, postgresErrorCode } from '../common/database-errors.js';
import { Site } from './site.entity.js';
import { toSiteResponse } from './site.mapper.js';

/** The fields that place a terminal: a change to any of them changes the path of the links on the site. */
export const SITE_GEOMETRY_FIELDS = ['latitudeDeg', 'longitudeDeg', 'groundElevationM', 'mountHeightM'] as const;

export interface SiteGeometryChange {
  field: (typeof SITE_GEOMETRY_FIELDS)[number];
  from: number;
  to: number;
}

/** Called inside the site update's transaction when the site's geometry changed. */
export type SiteGeometryChangeHandler = (manager: EntityManager, site: Site, changes: SiteGeometryChange[], caller: AuthUser) => Promise<void>;

@Injectable()
export class SitesService {
  private readonly geometryHandlers: SiteGeometryChangeHandler[] = [];

  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @InjectRepository(Site) private readonly sites: Repository<Site>,
  ) {}

  /** Lets a module that depends on sites (links) react to a moved site in the same transaction. */
  onGeometryChange(handler: SiteGeometryChangeHandler): void {
    this.geometryHandlers.push(handler);
  }

  async list(caller: AuthUser): Promise<SiteResponse[]> {
    const rows = await this.sites.find({ where: { organisationId: caller.organisationId }, order: { name: 'ASC' } });
    return rows.map(toSiteResponse);
  }

  async get(caller: AuthUser, id: string): Promise<SiteResponse> {
    return toSiteResponse(await this.findOwned(caller, id));
  }

  async create(caller: AuthUser, input: z.output<typeof CreateSiteRequestSchema>): Promise<SiteResponse> {
    const site = await this.sites.save(this.sites.create({ ...input, organisationId: caller.organisationId }));
    return toSiteResponse(site);
  }

  async update(caller: AuthUser, id: string, changes: z.output<typeof UpdateSiteRequestSchema>): Promise<SiteResponse> {
    return this.dataSource.transaction(async (manager) => {
      const site = await manager.findOne(Site, { where: { id, organisationId: caller.organisationId }, lock: { mode: 'pessimistic_write' } });
      if (!site) throw new NotFoundException('Site not found');
      const moved: SiteGeometryChange[] = SITE_GEOMETRY_FIELDS.flatMap((field) => {
        const to = changes[field];
        return to !== undefined && to !== site[field] ? [{ field, from: site[field], to }] : [];
      });
      Object.assign(site, Object.fromEntries(Object.entries(changes).filter(([, value]) => value !== undefined)));
      const saved = await manager.save(site);
      if (moved.length > 0) for (const handler of this.geometryHandlers) await handler(manager, saved, moved, caller);
      return toSiteResponse(saved);
    });
  }

  async remove(caller: AuthUser, id: string): Promise<void> {
    const site = await this.findOwned(caller, id);
    try {
      await this.sites.delete({ id: site.id, organisationId: caller.organisationId });
    } catch (error) {
      if (postgresErrorCode(error) === FOREIGN_KEY_VIOLATION) {
        throw new ConflictException('The site is used by a link; move the link to another site first');
      }
      throw error;
    }
  }

  /** Sites of the caller's organisation by id; used by other modules to check references. */
  async findOwnedByIds(caller: AuthUser, ids: readonly string[]): Promise<Site[]> {
    if (ids.length === 0) return [];
    return this.sites.find({ where: { organisationId: caller.organisationId, id: In([...new Set(ids)]) } });
  }

  private async findOwned(caller: AuthUser, id: string): Promise<Site> {
    // Scoped by organisation in the query itself: another organisation's id is simply not found.
    const site = await this.sites.findOne({ where: { id, organisationId: caller.organisationId } });
    if (!site) throw new NotFoundException('Site not found');
    return site;
  }
}
