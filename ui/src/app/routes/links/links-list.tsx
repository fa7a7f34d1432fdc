import { useEffect, useState } from 'react';
import { Link as RouterLink, useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';
import type { QueryClient } from '@tanstack/react-query';
import {
  Body1,
  Button,
  Caption1,
  Card,
  Dropdown,
  Field,
  MessageBar,
  MessageBarBody,
  Option,
  SearchBox,
  Skeleton,
  Switch,
  SkeletonItem,
  Text,
  Title2,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import { AddRegular, ChevronLeftRegular, ChevronRightRegular } from '@fluentui/react-icons';
import { paths } from '@/config/paths';
import { policies, useCurrentUser } from '@/lib/auth';
import { LinkListQuerySchema, type LinkStatus } from '@beamwright/link-core/contracts';
import type { LinkListParams } from '@/lib/query-keys';
import { getLinksQueryOptions, useLinks } from '@/features/links/api/get-links';
import { LinksTable } from '@/features/links/components/links-table';
import { LINK_STATUS_LABELS, LINK_STATUSES } from '@beamwright/link-core/contracts';

const PAGE_SIZE = 20;
const STATUS_OPTIONS: { value: LinkStatus | ''; label: string }[] = [
  { value: '', label: 'Any status' },
  ...LINK_STATUSES.map((status) => ({ value: status, label: LINK_STATUS_LABELS[status] })),
];

const useStyles = makeStyles({
  header: { display: 'flex', flexWrap: 'wrap', alignItems: 'flex-end', justifyContent: 'space-between', columnGap: tokens.spacingHorizontalL, rowGap: tokens.spacingVerticalS, marginBottom: tokens.spacingVerticalL },
  subtitle: { color: tokens.colorNeutralForeground3 },
  toolbar: { display: 'flex', flexWrap: 'wrap', alignItems: 'flex-end', columnGap: tokens.spacingHorizontalL, rowGap: tokens.spacingVerticalS, marginBottom: tokens.spacingVerticalM },
  search: { minWidth: 'min(280px, 100%)' },
  card: { padding: 0, overflowX: 'auto' },
  footer: { display: 'flex', alignItems: 'center', justifyContent: 'space-between', padding: tokens.spacingHorizontalM },
  empty: { padding: tokens.spacingHorizontalXXL, display: 'grid', rowGap: tokens.spacingVerticalS, justifyItems: 'start' },
});

/**
 * The list's search parameters, read with the api's own query schema: each one on its own, so a
 * parameter the schema refuses falls back to its default and leaves the others as they are.
 */
function readListQuery(searchParams: URLSearchParams): LinkListParams {
  const read = <Key extends 'page' | 'sort' | 'order' | 'status' | 'q'>(key: Key): LinkListParams[Key] => {
    const schema = LinkListQuerySchema.shape[key];
    const parsed = schema.safeParse(searchParams.get(key) ?? undefined);
    return (parsed.success ? parsed.data : schema.parse(undefined)) as LinkListParams[Key];
  };
  return {
    page: read('page'),
    pageSize: PAGE_SIZE,
    sort: read('sort'),
    order: read('order'),
    status: read('status'),
    q: read('q'),
    // the switch shows archived links with the others; the list never asks for archived ones alone
    archived: searchParams.get('archived') === 'include' ? 'include' : undefined,
  };
}

export function LinksListRoute() {
  const styles = useStyles();
  const [searchParams, setSearchParams] = useSearchParams();
  const query = readListQuery(searchParams);
  const links = useLinks(query);
  const role = useCurrentUser().data?.role;
  const [searchText, setSearchText] = useState(query.q ?? '');

  const update = (changes: Record<string, string | undefined>) => {
    const next = new URLSearchParams(searchParams);
    for (const [key, value] of Object.entries(changes)) {
      if (value === undefined || value === '') next.delete(key);
      else next.set(key, value);
    }
    setSearchParams(next, { replace: true });
  };

  // Ask the server once typing pauses, not on every key.
  useEffect(() => {
    const timer = window.setTimeout(() => {
      if ((query.q ?? '') !== searchText.trim()) update({ q: searchText.trim() || undefined, page: undefined });
    }, 250);
    return () => window.clearTimeout(timer);
    // Only typing restarts the pause; the URL update reads the latest query when it fires.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [searchText]);

  const total = links.data?.total ?? 0;
  const pageCount = Math.max(1, Math.ceil(total / PAGE_SIZE));
  const statusLabel = STATUS_OPTIONS.find((option) => option.value === (query.status ?? ''))?.label ?? 'Any status';

  return (
    <>
      <div className={styles.header}>
        <div>
          <Title2 as="h1">Links</Title2>
          <div>
            <Body1 className={styles.subtitle}>Every link of your organisation, with the margin of its latest revision.</Body1>
          </div>
        </div>
        {policies.canEditDesigns(role) && (
          <RouterLink to={paths.app.newLink.getHref()} tabIndex={-1}>
            <Button appearance="primary" icon={<AddRegular />}>
              New link
            </Button>
          </RouterLink>
        )}
      </div>

      <div className={styles.toolbar} role="search">
        <Field label="Search">
          <SearchBox
            className={styles.search}
            placeholder="Link or site name"
            value={searchText}
            onChange={(_, data) => setSearchText(data.value)}
            aria-label="Search links"
          />
        </Field>
        <Field label="Status">
          <Dropdown
            value={statusLabel}
            selectedOptions={[query.status ?? '']}
            onOptionSelect={(_, data) => update({ status: data.optionValue || undefined, page: undefined })}
            aria-label="Filter by status"
          >
            {STATUS_OPTIONS.map((option) => (
              <Option key={option.value || 'any'} value={option.value}>
                {option.label}
              </Option>
            ))}
          </Dropdown>
        </Field>
        <Switch
          label="Show archived links"
          checked={query.archived === 'include'}
          onChange={(_, data) => update({ archived: data.checked ? 'include' : undefined, page: undefined })}
        />
      </div>

      <Card className={styles.card}>
        {links.isError && (
          <MessageBar intent="error">
            <MessageBarBody>The links could not be loaded: {links.error.message}</MessageBarBody>
          </MessageBar>
        )}
        {links.isPending && (
          <Skeleton aria-label="Loading links" style={{ padding: 16, display: 'grid', rowGap: 12 }}>
            {Array.from({ length: 5 }, (_, index) => (
              <SkeletonItem key={index} size={32} />
            ))}
          </Skeleton>
        )}
        {links.data && links.data.items.length === 0 && (
          <div className={styles.empty}>
            <Text weight="semibold">No links match.</Text>
            <Text>
              {query.q || query.status ? 'Clear the search or the status filter to see every link.' : 'No link has been designed yet.'}
              {query.archived ? '' : ' Archived links are hidden unless “Show archived links” is on.'}
            </Text>
          </div>
        )}
        {links.data && links.data.items.length > 0 && (
          <LinksTable
            links={links.data.items}
            sort={{ field: query.sort, order: query.order }}
            onSortChange={(sort) => update({ sort: sort.field, order: sort.order, page: undefined })}
          />
        )}
        {links.data && total > 0 && (
          <div className={styles.footer}>
            <Caption1>
              {total} link{total === 1 ? '' : 's'} · page {query.page} of {pageCount}
            </Caption1>
            <div>
              <Button
                appearance="subtle"
                icon={<ChevronLeftRegular />}
                disabled={query.page <= 1}
                onClick={() => update({ page: String(query.page - 1) })}
                aria-label="Previous page"
              />
              <Button
                appearance="subtle"
                icon={<ChevronRightRegular />}
                disabled={query.page >= pageCount}
                onClick={() => update({ page: String(query.page + 1) })}
                aria-label="Next page"
              />
            </div>
          </div>
        )}
      </Card>
    </>
  );
}

/** Starts loading the page of links the address asks for, with the queryOptions useLinks reads. */
export const createLoader =
  (queryClient: QueryClient) =>
  ({ request }: LoaderFunctionArgs) => {
    void queryClient.prefetchQuery(getLinksQueryOptions(readListQuery(new URL(request.url).searchParams)));
    return null;
  };

export const Component = LinksListRoute;
