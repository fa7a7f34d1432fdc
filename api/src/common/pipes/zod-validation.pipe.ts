import { BadRequestException, Injectable, type PipeTransform } from '@nestjs/common';
import { formatZodIssues } from '@beamwright/link-core';
import type { z } from 'zod';

/**
 * The one validation pipe of the API: parses a body or query with a zod schema from link-core
 * and answers 400 with every invalid field's dotted path and reason. The parsed value (defaults
 * applied, unknown keys rejected where the schema is strict) is what the handler receives.
 */
@Injectable()
export class ZodValidationPipe<Schema extends z.ZodType> implements PipeTransform<unknown, z.output<Schema>> {
  constructor(
    private readonly schema: Schema,
    /** prefixed to every issue path, e.g. 'query' — empty for bodies so paths read `design.rangeM` */
    private readonly pathPrefix = '',
  ) {}

  transform(value: unknown): z.output<Schema> {
    // A missing body reaches the pipe as undefined; treat it as an empty object so the issues
    // name the required fields instead of saying "expected object".
    const result = this.schema.safeParse(value ?? {});
    if (result.success) return result.data;
    const issues = formatZodIssues(result.error).map((issue) => ({
      path: this.pathPrefix ? (issue.path ? `${this.pathPrefix}.${issue.path}` : this.pathPrefix) : issue.path,
      message: issue.message,
    }));
    const first = issues[0];
    const summary = first ? `${first.path || 'body'} ${first.message}` : 'Invalid request';
    throw new BadRequestException({
      message: issues.length > 1 ? `${summary} (and ${issues.length - 1} more)` : summary,
      issues,
    });
  }
}
