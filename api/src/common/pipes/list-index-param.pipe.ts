import { BadRequestException, Injectable, type PipeTransform } from '@nestjs/common';

/**
 * A path segment that must be a 0-based list index from 0 to `max` (a revision's variants); 400
 * naming it otherwise. An index in range that the list does not hold is the service's 404.
 */
@Injectable()
export class ListIndexParamPipe implements PipeTransform<string, number> {
  constructor(
    private readonly name: string,
    private readonly max: number,
  ) {}

  transform(value: string): number {
    const index = /^(0|[1-9]\d{0,8})$/.test(value) ? Number(value) : Number.NaN;
    if (!(index <= this.max)) {
      const message = `must be a whole number from 0 to ${this.max}`;
      throw new BadRequestException({ message: `${this.name} ${message}`, issues: [{ path: this.name, message }] });
    }
    return index;
  }
}
