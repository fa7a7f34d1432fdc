import { Organisation } from '../organisations/organisation.entity.js';
import { User } from '../users/user.entity.js';
import { Site } from '../sites/site.entity.js';

/** Every entity, for the CLI data source and the tests (the app also auto-loads them per module). */
export const ENTITIES = [Organisation, User, Site];
