import { describe, expect, it } from 'vitest';
import { expiresInToSeconds, validateEnv } from './env.schema.js';

describe('environment validation', () => {
  it('applies the documented defaults', () => {
    const env = validateEnv({ JWT_SECRET: 'a-secret-of-enough-length' });
    expect(env).toMatchObject({ PORT: 3000, HOST: '127.0.0.1', JWT_EXPIRES_IN: '8h', DEMO_PASSWORD: 'demo-pass-2026' });
    expect(env).toMatchObject({ SIGN_IN_MAX_ATTEMPTS_PER_ACCOUNT: 5, SIGN_IN_MAX_ATTEMPTS_PER_ADDRESS: 30, SIGN_IN_ATTEMPT_WINDOW: '15m', TRUST_PROXY_HOPS: 0 });
  });

  it('stops the boot with every bad variable named', () => {
    expect(() => validateEnv({ PORT: 'eighty', JWT_SECRET: 'short', JWT_EXPIRES_IN: 'soon' })).toThrow(/PORT[\s\S]*JWT_SECRET[\s\S]*JWT_EXPIRES_IN/);
  });

  it('names a bad sign-in limit', () => {
    expect(() => validateEnv({ JWT_SECRET: 'a-secret-of-enough-length', SIGN_IN_MAX_ATTEMPTS_PER_ACCOUNT: '0', SIGN_IN_ATTEMPT_WINDOW: 'a while' })).toThrow(
      /SIGN_IN_MAX_ATTEMPTS_PER_ACCOUNT: must be at least 1[\s\S]*SIGN_IN_ATTEMPT_WINDOW/,
    );
  });

  it('converts token lifetimes to seconds', () => {
    expect(expiresInToSeconds('8h')).toBe(28_800);
    expect(expiresInToSeconds('15m')).toBe(900);
    expect(expiresInToSeconds('2d')).toBe(172_800);
    expect(expiresInToSeconds('45')).toBe(45);
  });
});
