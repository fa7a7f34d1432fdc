/**
 * @beamwright/link-core/contracts — request and response shapes of the Beamwright HTTP API, as
 * zod schemas and their types. The API validates requests with them and the UI reads responses
 * through them, so the two never disagree about a field. Pure: no framework imports.
 */
export * from './error.contract.js';
export * from './auth.contract.js';
export * from './health.contract.js';
export * from './common.contract.js';
export * from './sites.contract.js';
export * from './equipment.contract.js';
export * from './links.contract.js';
export * from './variants.contract.js';
export * from './reviews.contract.js';
export * from './design-diff.js';
export * from './workflow-rules.js';
