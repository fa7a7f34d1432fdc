import { describe, expect, it } from 'vitest';
import { REQUIRED_LINK_MARGIN_DB } from '../budget/engine-version.js';
import { formatZodIssues } from '../schemas/format-zod-issues.js';
import { FADE_PROBABILITY_MESSAGE, LINK_DESIGN_DEFAULTS } from '../schemas/link-design.schema.js';
import { ORGANISATION_DEFAULTS, UpdateOrganisationSettingsRequestSchema } from './organisation-settings.contract.js';

describe('organisation settings contract', () => {
  it('starts from the engine defaults', () => {
    expect(ORGANISATION_DEFAULTS.requiredMarginDb).toBe(REQUIRED_LINK_MARGIN_DB);
    expect(ORGANISATION_DEFAULTS.fadeProbability).toBe(LINK_DESIGN_DEFAULTS.scintillationProbability);
    expect(ORGANISATION_DEFAULTS.visibilityDefinition).toBe(LINK_DESIGN_DEFAULTS.visibilityDefinition);
  });

  it('names each bad field with its reason', () => {
    const result = UpdateOrganisationSettingsRequestSchema.safeParse({ name: '  ', requiredMarginDb: -1, fadeProbability: 0.9, visibilityDefinition: 'fog', distanceUnit: 'ft', extra: 1 });
    expect(result.success).toBe(false);
    const issues = formatZodIssues(result.error!);
    expect(Object.fromEntries(issues.map((issue) => [issue.path, issue.message]))).toMatchObject({
      requiredMarginDb: 'must be at least 0',
      fadeProbability: FADE_PROBABILITY_MESSAGE,
      visibilityDefinition: 'must be one of contrast-2-percent, mor-5-percent',
      distanceUnit: 'must be one of m, km, mi',
    });
    expect(issues.map((issue) => issue.path)).toEqual(expect.arrayContaining(['name']));
  });
});
