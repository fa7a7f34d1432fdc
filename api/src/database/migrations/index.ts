/**
 * Every migration, in order. The TypeORM CLI writes new files into this folder; add the class
 * here too (the compiled app, the CLI and the tests all read this list, so no file globbing).
 */
import { CreateOrganisationsAndUsers1796185289124 } from './1796185289124-CreateOrganisationsAndUsers.js';
import { CreateSites1796185423186 } from './1796185423186-CreateSites.js';
import { CreateEquipmentLinksRevisionsReviews1796185633635 } from './1796185633635-CreateEquipmentLinksRevisionsReviews.js';
import { CreateRateLimitCounters1796200000000 } from './1796200000000-CreateRateLimitCounters.js';
import { CreateUserSessionsAndDeactivation1796200100000 } from './1796200100000-CreateUserSessionsAndDeactivation.js';
import { AddLinkArchiveAndPathChange1796300000000 } from './1796300000000-AddLinkArchiveAndPathChange.js';
import { AddRevisionVariants1796414178325 } from './1796414178325-AddRevisionVariants.js';

export const MIGRATIONS = [
  CreateOrganisationsAndUsers1796185289124,
  CreateSites1796185423186,
  CreateEquipmentLinksRevisionsReviews1796185633635,
  CreateRateLimitCounters1796200000000,
  CreateUserSessionsAndDeactivation1796200100000,
  AddLinkArchiveAndPathChange1796300000000,
  AddRevisionVariants1796414178325,
];
