import { describe, expect, it } from 'vitest';
import { QueryClient } from '@tanstack/react-query';
import { linkKeys, reviewKeys } from '@/lib/query-keys';

const A = '0b7f5f1e-5a1c-4c55-9d0a-3e1d2a4b5c6d';
const B = '11111111-1111-4111-8111-111111111111';
const query = { page: 1, pageSize: 20, sort: 'updatedAt', order: 'desc' } as const;

describe('query keys', () => {
  it('nest general to specific: a link reviews, revisions and diffs sit under its detail', () => {
    expect(reviewKeys.forLink(A)).toEqual([...linkKeys.detail(A), 'reviews']);
    expect(linkKeys.revisions(A).slice(0, 3)).toEqual([...linkKeys.detail(A)]);
    expect(linkKeys.diff(A, 1, 2).slice(0, 3)).toEqual([...linkKeys.detail(A)]);
    expect(linkKeys.list(query).slice(0, 2)).toEqual([...linkKeys.lists()]);
  });

  it('invalidate one link with everything under it, and not another link or the lists', async () => {
    const client = new QueryClient();
    const keys = [linkKeys.detail(A), reviewKeys.forLink(A), linkKeys.revisions(A), linkKeys.detail(B), reviewKeys.forLink(B), linkKeys.list(query)];
    for (const key of keys) client.setQueryData(key, { filled: true });
    await client.invalidateQueries({ queryKey: linkKeys.detail(A) });
    expect(keys.map((key) => client.getQueryState(key)?.isInvalidated)).toEqual([true, true, true, false, false, false]);

    await client.invalidateQueries({ queryKey: linkKeys.lists() });
    expect(client.getQueryState(linkKeys.list(query))?.isInvalidated).toBe(true);
    expect(client.getQueryState(linkKeys.detail(B))?.isInvalidated).toBe(false);
  });
});
