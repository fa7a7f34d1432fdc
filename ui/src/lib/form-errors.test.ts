import { describe, expect, it } from 'vitest';
import { ApiError } from '@/lib/api-client';
import { apiFieldIssues, mapIssuesToFields, setApiFieldErrors } from '@/lib/form-errors';

const refused = (body: unknown) => new ApiError(400, body, 'Request failed (400)');
const validationBody = (issues: { path: string; message: string }[]) => ({ statusCode: 400, error: 'Bad Request', message: 'Validation failed', issues });

describe('issues → field errors', () => {
  it('reads the issues of a 400 with the contract error schema, and nothing from other answers', () => {
    expect(apiFieldIssues(refused(validationBody([{ path: 'name', message: 'is required' }])))).toEqual([{ path: 'name', message: 'is required' }]);
    // a body that is not the contract's error shape carries no field issues
    expect(apiFieldIssues(refused({ issues: [{ path: 'name' }] }))).toEqual([]);
    expect(apiFieldIssues(new ApiError(409, validationBody([{ path: 'name', message: 'x' }]), 'conflict'))).toEqual([]);
    expect(apiFieldIssues(new Error('offline'))).toEqual([]);
  });

  it('puts each issue beside the field its path names, first issue first, and returns the rest', () => {
    const mapped = mapIssuesToFields(
      [
        { path: 'design.rangeM', message: 'must be at least 1' },
        { path: 'design.rangeM', message: 'second reason' },
        { path: 'name', message: 'is already used by another link' },
        { path: 'design.unknownField', message: 'is not allowed' },
      ],
      (path) => (path === 'design.rangeM' ? { field: 'rangeText', label: 'Path length' } : path === 'name' ? { field: 'name' } : null),
    );
    expect(mapped.fieldErrors).toEqual({ rangeText: 'Path length must be at least 1', name: 'is already used by another link' });
    expect(mapped.unmatched).toEqual([{ path: 'design.unknownField', message: 'is not allowed' }]);
  });

  it('sets the field errors on the form and says when there were none to set', () => {
    const set: [string, string][] = [];
    const result = setApiFieldErrors(refused(validationBody([{ path: 'comment', message: 'is required' }])), (field, error) => set.push([field, error.message]), () => ({
      field: 'comment',
      label: 'Comment',
    }));
    expect(set).toEqual([['comment', 'Comment is required']]);
    expect(result).toEqual({ fieldCount: 1, unmatched: [] });
    expect(setApiFieldErrors(new Error('offline'), () => undefined, () => null)).toBeNull();
  });
});
