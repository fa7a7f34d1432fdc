import { describe, expect, it } from 'vitest';
import { diffDesigns } from './design-diff.js';

describe('diffDesigns', () => {
  it('lists changed, added and removed leaves by dotted path, sorted', () => {
    const from = { rangeM: 1000, transmitter: { powerDbm: 10, m2: 1 }, receiver: { overloadDbm: -5 } };
    const to = { rangeM: 1500, transmitter: { powerDbm: 10, m2: 1.2, halfAngleDivergenceRad: 1e-3 }, receiver: {} };
    expect(diffDesigns(from, to)).toEqual([
      { path: 'rangeM', from: 1000, to: 1500 },
      { path: 'receiver.overloadDbm', from: -5, to: null },
      { path: 'transmitter.halfAngleDivergenceRad', from: null, to: 1e-3 },
      { path: 'transmitter.m2', from: 1, to: 1.2 },
    ]);
  });

  it('is empty for equal designs, whatever the key order', () => {
    expect(diffDesigns({ a: 1, b: { c: true } }, { b: { c: true }, a: 1 })).toEqual([]);
  });
});

describe('diffDesigns with absent sides', () => {
  it('treats an undefined field and a missing design like absent fields', () => {
    expect(diffDesigns({ rangeM: 1000, receiver: { overloadDbm: undefined } }, { rangeM: 1000 })).toEqual([]);
    expect(diffDesigns(null, { rangeM: 1000 })).toEqual([{ path: 'rangeM', from: null, to: 1000 }]);
  });
});
