import { describe, expect, it } from 'vitest';
import { formatZodIssues } from '../schemas/format-zod-issues.js';
import {
  CreateEquipmentRequestSchema,
  CreateLinkRequestSchema,
  CreateRevisionRequestSchema,
  CreateSiteRequestSchema,
  LinkListQuerySchema,
  LoginRequestSchema,
  ReturnRevisionRequestSchema,
} from './index.js';

const design = {
  rangeM: 1000,
  transmitter: { wavelengthM: 850e-9, powerDbm: 15, waistRadiusM: 0.02, opticsLossDb: 1 },
  receiver: { apertureDiameterM: 0.1, sensitivityDbm: -30, opticsLossDb: 1 },
  pointing: { jitterSigmaPerAxisRad: 5e-5, staticErrorRad: 1e-4 },
  atmosphere: { visibilityM: 5000, cn2: 1e-14 },
};

function issues(result: { success: boolean; error?: { issues: import('zod').z.core.$ZodIssue[] } }) {
  return result.success ? [] : formatZodIssues(result.error!);
}

describe('api contracts', () => {
  it('name each missing or malformed field the way a form shows it', () => {
    expect(issues(LoginRequestSchema.safeParse({ email: 'x' }))).toEqual([
      { path: 'email', message: 'must be an e-mail address' },
      { path: 'password', message: 'is required' },
    ]);
    expect(issues(CreateRevisionRequestSchema.safeParse({ design, baseRevision: 1.5 }))).toEqual([{ path: 'baseRevision', message: 'must be a whole number' }]);
    expect(issues(ReturnRevisionRequestSchema.safeParse({ comment: '   ' }))).toEqual([{ path: 'comment', message: 'is required' }]);
    expect(issues(CreateSiteRequestSchema.safeParse({ name: 'Roof', latitudeDeg: 91, longitudeDeg: 0, groundElevationM: 0, mountHeightM: -1 }))).toEqual([
      { path: 'latitudeDeg', message: 'must be at most 90' },
      { path: 'mountHeightM', message: 'must be at least 0' },
    ]);
  });

  it('apply design defaults and trim text on the way in', () => {
    const parsed = CreateLinkRequestSchema.parse({ name: '  Hop  ', design });
    expect(parsed.name).toBe('Hop');
    expect(parsed.note).toBe('');
    expect(parsed.design.transmitter.m2).toBe(1);
    expect(parsed.design.scintillation).toEqual({ include: true, probability: 1e-3 });
  });

  it('read list queries from strings, with defaults, and reject unknown parameters', () => {
    expect(LinkListQuerySchema.parse({ page: '3', status: 'in_review' })).toEqual({ page: 3, pageSize: 20, sort: 'updatedAt', order: 'desc', status: 'in_review' });
    expect(issues(LinkListQuerySchema.safeParse({ pageSize: '0', colour: 'red' })).map((issue) => issue.path).sort()).toEqual(['colour', 'pageSize']);
  });

  it('check equipment figures by kind', () => {
    const receiver = { kind: 'receiver', name: 'Rx', spec: { apertureDiameterM: 0.1, opticsLossDb: 1, sensitivityDbm: -30, dataRateBps: 1e9, overloadDbm: -31 } };
    expect(issues(CreateEquipmentRequestSchema.safeParse(receiver))).toEqual([{ path: 'spec.overloadDbm', message: 'must be greater than the sensitivity' }]);
    const transmitter = { kind: 'transmitter', name: 'Tx', spec: { wavelengthM: 1.55e-6, powerDbm: 20, beamSize: { kind: 'waist-radius', waistRadiusM: 0.025 }, opticsLossDb: 1 } };
    expect(CreateEquipmentRequestSchema.parse(transmitter)).toMatchObject({ maker: '', notes: '', spec: { m2: 1 } });
  });
});
