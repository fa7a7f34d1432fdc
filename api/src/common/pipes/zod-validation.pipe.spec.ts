import { BadRequestException } from '@nestjs/common';
import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { LinkDesignSchema } from '@beamwright/link-core';
import { ZodValidationPipe } from './zod-validation.pipe.js';

describe('ZodValidationPipe', () => {
  const schema = z.strictObject({ name: z.string().min(1, 'is required'), design: LinkDesignSchema });

  function issuesOf(value: unknown, pipe: ZodValidationPipe<z.ZodType> = new ZodValidationPipe(schema)) {
    try {
      pipe.transform(value);
    } catch (error) {
      expect(error).toBeInstanceOf(BadRequestException);
      return ((error as BadRequestException).getResponse() as { issues: { path: string; message: string }[] }).issues;
    }
    throw new Error('expected a validation error');
  }

  it('names nested fields by their dotted path', () => {
    const issues = issuesOf({ name: 'x', design: { rangeM: 1000, transmitter: { wavelengthM: -1 } } });
    expect(issues).toContainEqual({ path: 'design.transmitter.wavelengthM', message: 'must be at least 200 nm' });
    expect(issues.map((issue) => issue.path)).toContain('design.receiver');
  });

  it('reports unknown keys on the key itself', () => {
    expect(issuesOf({ name: 'x', nmae: 'y' })).toContainEqual({ path: 'nmae', message: 'is not a known field' });
  });

  it('treats a missing body as an empty object, so required fields are named', () => {
    expect(issuesOf(undefined).map((issue) => issue.path)).toEqual(expect.arrayContaining(['name', 'design']));
  });

  it('prefixes paths when given a prefix, and returns the parsed value on success', () => {
    const query = z.object({ page: z.coerce.number().int().min(1, 'must be at least 1').default(1) });
    expect(issuesOf({ page: '0' }, new ZodValidationPipe(query, 'query'))).toEqual([{ path: 'query.page', message: 'must be at least 1' }]);
    expect(new ZodValidationPipe(query).transform({})).toEqual({ page: 1 });
  });
});
