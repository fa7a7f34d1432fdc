import { describe, expect, it } from 'vitest';
import { toFixedTwo } from './budget-text.js';

describe('toFixedTwo', () => {
  it('writes exactly what toFixed(2) writes (the JavaScript built-in is the reference)', () => {
    const values = [0, -0, 0.004, -0.004, 0.005, 1.005, 2.675, -2.675, 0.125, 0.995, -0.995, 9.995, 99.999, 1e-300, -1e-9, 123456.785, 1e14, 3e15, 1e21, 1.5, -1.5];
    let state = 20261203;
    for (let i = 0; i < 20000; i++) {
      state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
      const scale = 10 ** ((state % 9) - 3);
      values.push(((state / 4294967296) * 2 - 1) * scale * 7);
      values.push(Math.round((state / 4294967296) * 1e6) / 1000); // many exact thousandths, near ties
    }
    for (const value of values) expect(toFixedTwo(value), String(value)).toBe(value.toFixed(2));
  });
});
