import { BadRequestException, ParseUUIDPipe } from '@nestjs/common';

/**
 * Path ids must be UUIDs: anything else is a 400 naming the parameter (documented choice; a
 * well-formed id that does not exist, or belongs to another organisation, is a 404).
 */
export function uuidParam(name = 'id'): ParseUUIDPipe {
  return new ParseUUIDPipe({
    exceptionFactory: () => new BadRequestException({ message: `${name} must be a UUID`, issues: [{ path: name, message: 'must be a UUID' }] }),
  });
}
