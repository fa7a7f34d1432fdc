import { z } from 'zod';

/**
 * OpenAPI (3.0) schema of a zod schema, so /api/docs documents the same shapes the pipe enforces.
 * `io: 'input'` describes what a client sends (defaults optional); 'output' what it receives.
 */
export function openApiSchema(schema: z.ZodType, io: 'input' | 'output' = 'input'): Record<string, unknown> {
  return z.toJSONSchema(schema, { target: 'openapi-3.0', io, unrepresentable: 'any' }) as Record<string, unknown>;
}
