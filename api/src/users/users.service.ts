import { Injectable } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import { In, Repository } from 'typeorm';
import { User } from './user.entity.js';
import { normaliseEmail } from './normalise-email.js';

@Injectable()
export class UsersService {
  constructor(@InjectRepository(User) private readonly users: Repository<User>) {}

  findByEmail(email: string): Promise<User | null> {
    return this.users.findOne({ where: { email: normaliseEmail(email) } });
  }

  findInOrganisation(organisationId: string, userId: string): Promise<User | null> {
    return this.users.findOne({ where: { id: userId, organisationId }, relations: { organisation: true } });
  }

  /** display names for a set of user ids of one organisation (for author and reviewer labels) */
  async displayNames(organisationId: string, userIds: readonly string[]): Promise<Map<string, string>> {
    const unique = [...new Set(userIds)];
    if (unique.length === 0) return new Map();
    const rows = await this.users.find({ where: { organisationId, id: In(unique) }, select: { id: true, displayName: true } });
    return new Map(rows.map((row) => [row.id, row.displayName]));
  }
}
