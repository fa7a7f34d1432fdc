import type { OrganisationSettings } from '@beamwright/link-core/contracts';
import type { Organisation } from './organisation.entity.js';

export function toOrganisationSettings(organisation: Organisation): OrganisationSettings {
  return {
    id: organisation.id,
    name: organisation.name,
    requiredMarginDb: organisation.requiredMarginDb,
    fadeProbability: organisation.fadeProbability,
    visibilityDefinition: organisation.visibilityDefinition,
    distanceUnit: organisation.distanceUnit,
  };
}
