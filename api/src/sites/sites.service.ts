import { ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource, InjectRepository } from '@nestjs/typeorm';
import { DataSource, In, Repository, type EntityManager } from 'typeorm';
import type { CreateSiteRequestSchema, SiteResponse, SiteUserLink, UpdateSiteRequestSchema } from '@beamwright/link-core/contracts';
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

/** The 409 that names the links still using a site (`SiteInUseBodySchema`). */
function siteInUse(links: SiteUserLink[]): ConflictException {
  const names = links.slice(0, 5).map((link) => `“${link.name}”`).join(', ');
  const more = links.length > 5 ? ` and ${links.length - 5} more` : '';
  const noun = links.length === 1 ? 'link uses' : `${links.length} links use`;
  return new ConflictException({ message: `The site cannot be deleted: ${noun} it (${names}${more}). Move ${links.length === 1 ? 'that link' : 'those links'} to another site first.`, links });
}

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
    await this.dataSource.transaction(async (manager) => {
      const site = await manager.findOne(Site, { where: { id, organisationId: caller.organisationId }, lock: { mode: 'pessimistic_write' } });
      if (!site) throw new NotFoundException('Site not found');
      // Checked before the delete so the refusal can name the links; the foreign key stays the
      // guarantee (a link saved onto the site meanwhile still makes the delete fail below).
      const users = await this.linksUsing(manager, caller, site.id);
      if (users.length > 0) throw siteInUse(users);
      try {
        await manager.delete(Site, { id: site.id, organisationId: caller.organisationId });
      } catch (error) {
        if (postgresErrorCode(error) === FOREIGN_KEY_VIOLATION) throw siteInUse(await this.linksUsing(this.dataSource.manager, caller, site.id));
        throw error;
      }
    });
  }

  /**
   * The links (archived ones too) with the site at either end. The links module depends on this
   * one, so the query reads the link table directly rather than through its service.
   */
  private async linksUsing(manager: EntityManager, caller: AuthUser, siteId: string): Promise<SiteUserLink[]> {
    const rows = (await manager.query(
      'SELECT id, name FROM link WHERE organisation_id = $1 AND (site_a_id = $2 OR site_b_id = $2) ORDER BY name, id',
      [caller.organisationId, siteId],
    )) as { id: string; name: string }[];
    return rows.map((row) => ({ id: row.id, name: row.name }));
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
