import { Injectable, NotFoundException } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import { Repository } from 'typeorm';
import type { OrganisationSettings, UpdateOrganisationSettingsRequestSchema } from '@beamwright/link-core/contracts';
import type { z } from 'zod';
import type { AuthUser } from '../common/auth-user.js';
import { Organisation } from './organisation.entity.js';
import { toOrganisationSettings } from './organisation-settings.mapper.js';

@Injectable()
export class OrganisationSettingsService {
  constructor(@InjectRepository(Organisation) private readonly organisations: Repository<Organisation>) {}

  /** The caller's own organisation: there is no route to another one's. */
  async get(caller: AuthUser): Promise<OrganisationSettings> {
    return toOrganisationSettings(await this.findOwn(caller));
  }

  async update(caller: AuthUser, changes: z.output<typeof UpdateOrganisationSettingsRequestSchema>): Promise<OrganisationSettings> {
    const organisation = await this.findOwn(caller);
    Object.assign(organisation, Object.fromEntries(Object.entries(changes).filter(([, value]) => value !== undefined)));
    return toOrganisationSettings(await this.organisations.save(organisation));
  }

  private async findOwn(caller: AuthUser): Promise<Organisation> {
    const organisation = await this.organisations.findOne({ where: { id: caller.organisationId } });
    if (!organisation) throw new NotFoundException('Organisation not found');
    return organisation;
  }
}
