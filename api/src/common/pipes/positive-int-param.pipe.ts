import { BadRequestException, Injectable, type PipeTransform } from '@nestjs/common';

/** A path segment that must be a whole number ≥ 1 (revision numbers); 400 naming it otherwise. */
@Injectable()
export class PositiveIntParamPipe implements PipeTransform<string, number> {
  constructor(private readonly name: string) {}

  transform(value: string): number {
    if (!/^[1-9]\d{0,8}$/.test(value)) {
      throw new BadRequestException({ message: `${this.name} must be a whole number of at least 1`, issues: [{ path: this.name, message: 'must be a whole number of at least 1' }] });
    }
    return Number(value);
  }
}
