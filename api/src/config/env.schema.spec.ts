import { describe, expect, it } from 'vitest';
import { expiresInToSeconds, validateEnv } from './env.schema.js';

describe('environment validation', () => {
  it('applies the documented defaults', () => {
    const env = validateEnv({ JWT_SECRET: 'a-secret-of-enough-length' });
    expect(env).toMatchObject({ PORT: 3000, HOST: '127.0.0.1', JWT_EXPIRES_IN: '8h', DEMO_PASSWORD: 'demo-pass-2026' });
  });

  it('stops the boot with every bad variable named', () => {
    expect(() => validateEnv({ PORT: 'eighty', JWT_SECRET: 'short', JWT_EXPIRES_IN: 'soon' })).toThrow(/PORT[\s\S]*JWT_SECRET[\s\S]*JWT_EXPIRES_IN/);
  });

  it('converts token lifetimes to seconds', () => {
    expect(expiresInToSeconds('8h')).toBe(28_800);
    expect(expiresInToSeconds('15m')).toBe(900);
    expect(expiresInToSeconds('2d')).toBe(172_800);
    expect(expiresInToSeconds('45')).toBe(45);
  });
});
