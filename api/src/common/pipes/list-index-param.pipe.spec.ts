import { BadRequestException } from '@nestjs/common';
import { describe, expect, it } from 'vitest';
import { toErrorBody } from '../filters/api-exception.filter.js';
import { ListIndexParamPipe } from './list-index-param.pipe.js';

describe('ListIndexParamPipe', () => {
  const pipe = new ListIndexParamPipe('index', 7);

  it('reads 0 to max as numbers', () => {
    expect([pipe.transform('0'), pipe.transform('3'), pipe.transform('7')]).toEqual([0, 3, 7]);
  });

  it.each(['8', '-1', '1.5', '01', '1e1', 'NaN', '', ' 1', '99999999999999999999', 'abc'])('refuses %j with a 400 naming the parameter', (value) => {
    let thrown: unknown;
    try {
      pipe.transform(value);
    } catch (error) {
      thrown = error;
    }
    expect(thrown).toBeInstanceOf(BadRequestException);
    expect(toErrorBody(thrown).issues).toEqual([{ path: 'index', message: 'must be a whole number from 0 to 7' }]);
  });
});
