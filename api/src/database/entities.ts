import { Organisation } from '../organisations/organisation.entity.js';
import { User } from '../users/user.entity.js';
import { Site } from '../sites/site.entity.js';
import { EquipmentModel } from '../equipment/equipment-model.entity.js';
import { Link } from '../links/link.entity.js';
import { LinkRevision } from '../links/link-revision.entity.js';
import { LinkRevisionVariant } from '../links/link-revision-variant.entity.js';
import { LinkReview } from '../links/link-review.entity.js';
import { UserSession } from '../auth/user-session.entity.js';
import { RateLimitCounter } from '../rate-limits/rate-limit-counter.entity.js';

/** Every entity, for the CLI data source and the tests (the app also auto-loads them per module). */
export const ENTITIES = [Organisation, User, Site, EquipmentModel, Link, LinkRevision, LinkRevisionVariant, LinkReview, UserSession, RateLimitCounter];
