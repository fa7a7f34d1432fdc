import { ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import { In, Repository } from 'typeorm';
import type { CreateSiteRequestSchema, SiteResponse, UpdateSiteRequestSchema } from '@beamwright/link-core/contracts';
import type { z } from 'zod';
import type { AuthUser } from '../common/auth-user.js';
import { FOREIGN_KEY_VIOLATION, postgresErrorCode } from '../common/database-errors.js';
import { Site } from './site.entity.js';
import { toSiteResponse } from './site.mapper.js';

@Injectable()
export class SitesService {
  constructor(@InjectRepository(Site) private readonly sites: Repository<Site>) {}

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
    const site = await this.findOwned(caller, id);
    Object.assign(site, Object.fromEntries(Object.entries(changes).filter(([, value]) => value !== undefined)));
    return toSiteResponse(await this.sites.save(site));
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
