import { describe, expect, it } from 'vitest';
import { formatZodIssues } from '../schemas/format-zod-issues.js';
import { LINK_STATUS_LABELS, LINK_STATUS_PHRASES, LINK_STATUSES } from './links.contract.js';
import { siteTerminalHeightM, siteTerminalOf } from './sites.contract.js';
import {
  CreateEquipmentRequestSchema,
  CreateLinkRequestSchema,
  CreateRevisionRequestSchema,
  CreateSiteRequestSchema,
  LinkListQuerySchema,
  LoginRequestSchema,
  ReturnRevisionRequestSchema,
  ReviewCommentRequestSchema,
  UpdateEquipmentRequestSchema,
  UpdateLinkRequestSchema,
  UpdateSiteRequestSchema,
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

describe('text fields of the contracts', () => {
  const site = { name: 'Roof', latitudeDeg: 0, longitudeDeg: 0, groundElevationM: 0, mountHeightM: 1 };
  const transmitter = { kind: 'transmitter', name: 'Tx', spec: { wavelengthM: 1.55e-6, powerDbm: 20, beamSize: { kind: 'waist-radius', waistRadiusM: 0.025 }, opticsLossDb: 1 } };
  const receiver = { kind: 'receiver', name: 'Rx', spec: { apertureDiameterM: 0.1, opticsLossDb: 1, sensitivityDbm: -30, dataRateBps: 1e9 } };
  // [schema, a valid body, its text fields, which of them are multiline]
  const table: [string, import('zod').z.ZodType, Record<string, unknown>, string[], string[]][] = [
    ['create link', CreateLinkRequestSchema, { name: 'Hop', design }, ['name', 'note'], ['note']],
    ['update link', UpdateLinkRequestSchema, {}, ['name'], []],
    ['new revision', CreateRevisionRequestSchema, { baseRevision: 1, design }, ['note'], ['note']],
    ['create site', CreateSiteRequestSchema, site, ['name', 'notes'], ['notes']],
    ['update site', UpdateSiteRequestSchema, {}, ['name', 'notes'], ['notes']],
    ['create transmitter', CreateEquipmentRequestSchema, transmitter, ['name', 'maker', 'notes'], ['notes']],
    ['create receiver', CreateEquipmentRequestSchema, receiver, ['name', 'maker', 'notes'], ['notes']],
    ['update equipment', UpdateEquipmentRequestSchema, {}, ['name', 'maker', 'notes'], ['notes']],
    ['review comment', ReviewCommentRequestSchema, {}, ['comment'], ['comment']],
    ['return comment', ReturnRevisionRequestSchema, { comment: 'x' }, ['comment'], ['comment']],
    ['link search', LinkListQuerySchema, {}, ['q'], []],
  ];

  it.each(table)('%s: a NUL is refused naming the field, a line break only where multiline, text comes out NFC', (_name, schema, body, fields, multiline) => {
    for (const field of fields) {
      expect(issues(schema.safeParse({ ...body, [field]: 'a\u0000b' }))).toEqual([{ path: field, message: expect.stringMatching(/^must not contain control characters/) }]);
      const twoLines = schema.safeParse({ ...body, [field]: 'a\nb' });
      expect(twoLines.success, `${field} with a line break`).toBe(multiline.includes(field));
      const composed = schema.parse({ ...body, [field]: 'Cafe\u0301' }) as Record<string, unknown>;
      expect(composed[field]).toBe('Caf\u00e9');
    }
  });
});

describe('shared display and site rules', () => {
  it('names every link status once, as a label and inside a sentence', () => {
    expect(LINK_STATUSES.map((status) => LINK_STATUS_LABELS[status])).toEqual(['Draft', 'In review', 'Approved', 'Installed']);
    expect(LINK_STATUSES.map((status) => `The link is ${LINK_STATUS_PHRASES[status]}`)).toEqual([
      'The link is a draft',
      'The link is in review',
      'The link is approved',
      'The link is installed',
    ]);
  });

  it("puts a site's terminal at its ground elevation plus its mount height", () => {
    const site = { latitudeDeg: 51.5, longitudeDeg: -0.12, groundElevationM: 42.5, mountHeightM: 3.2 };
    expect(siteTerminalHeightM(site)).toBeCloseTo(45.7, 12);
    expect(siteTerminalOf(site)).toEqual({ latDeg: 51.5, lonDeg: -0.12, heightM: siteTerminalHeightM(site) });
  });
});
