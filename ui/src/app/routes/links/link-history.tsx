import { useEffect, useState } from 'react';
import { Link as RouterLink } from 'react-router-dom';
import {
  Button,
  Caption1,
  Field,
  MessageBar,
  MessageBarBody,
  Select,
  Skeleton,
  SkeletonItem,
  Spinner,
  Subtitle2,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import { ArrowLeftRegular } from '@fluentui/react-icons';
import { paths } from '@/config/paths';
import { useCurrentUser } from '@/lib/auth';
import { ErrorView } from '@/components/errors/route-error';
import { useLink } from '@/features/links/api/get-link';
import { useRevisions } from '@/features/links/api/get-revisions';
import { useLinkDiff } from '@/features/links/api/get-link-diff';
import { LinkHeader } from '@/features/links/components/link-header';
import { RevisionsTable } from '@/features/links/components/revisions-table';
import { useReviews } from '@/features/reviews/api/get-reviews';
import { ReviewTrail } from '@/features/reviews/components/review-trail';
import { ReviewActions } from '@/features/reviews/components/review-actions';
import { DesignChangesTable } from '@/features/link-design/components/design-changes-table';
import { describeChange } from '@/features/link-design/design-diff';
import { linkPageLoader, useLinkIdParam } from '@/app/routes/links/link-route-params';

const useStyles = makeStyles({
  layout: {
    display: 'grid',
    gridTemplateColumns: 'minmax(0, 2fr) minmax(300px, 1fr)',
    gap: tokens.spacingHorizontalXL,
    alignItems: 'start',
    '@media (max-width: 1100px)': { gridTemplateColumns: '1fr' },
  },
  card: {
    backgroundColor: tokens.colorNeutralBackground1,
    border: `1px solid ${tokens.colorNeutralStroke2}`,
    borderRadius: tokens.borderRadiusLarge,
    padding: tokens.spacingHorizontalL,
    display: 'grid',
    rowGap: tokens.spacingVerticalM,
    minWidth: 0,
  },
  column: { display: 'grid', rowGap: tokens.spacingVerticalXL, minWidth: 0 },
  pickers: { display: 'flex', columnGap: tokens.spacingHorizontalL, flexWrap: 'wrap', alignItems: 'flex-end' },
  muted: { color: tokens.colorNeutralForeground3 },
});

export function LinkHistoryRoute() {
  const styles = useStyles();
  const linkId = useLinkIdParam();
  const link = useLink(linkId);
  const revisions = useRevisions(linkId);
  const reviews = useReviews(linkId);
  const me = useCurrentUser().data;
  const role = me?.role;
  const [from, setFrom] = useState<number | null>(null);
  const [to, setTo] = useState<number | null>(null);

  // Compare the latest revision with the one before it until the user picks others.
  const latest = link.data?.revision ?? null;
  useEffect(() => {
    if (latest === null) return;
    setTo((current) => current ?? latest);
    setFrom((current) => current ?? Math.max(1, latest - 1));
  }, [latest]);

  const diff = useLinkDiff(linkId, from, to);

  if (link.isPending) {
    return (
      <Skeleton aria-label="Loading the history">
        <SkeletonItem style={{ height: 320 }} />
      </Skeleton>
    );
  }
  if (link.isError) return <ErrorView error={link.error} />;

  const numbers = (revisions.data ?? []).map((revision) => revision.revision).sort((a, b) => b - a);

  return (
    <>
      <LinkHeader
        link={link.data}
        section="History and review"
        actions={
          <RouterLink to={paths.app.link.getHref(linkId)} tabIndex={-1}>
            <Button icon={<ArrowLeftRegular />}>Back to the design</Button>
          </RouterLink>
        }
      />
      <div className={styles.layout}>
        <div className={styles.column}>
          <section className={styles.card} aria-labelledby="revisions-heading">
            <Subtitle2 as="h2" id="revisions-heading">
              Revisions
            </Subtitle2>
            {revisions.isPending && <Spinner size="small" label="Loading revisions…" />}
            {revisions.isError && (
              <MessageBar intent="error">
                <MessageBarBody>{revisions.error.message}</MessageBarBody>
              </MessageBar>
            )}
            {revisions.data && <RevisionsTable revisions={revisions.data} />}
          </section>

          <section className={styles.card} aria-labelledby="compare-heading">
            <Subtitle2 as="h2" id="compare-heading">
              Compare two revisions
            </Subtitle2>
            {numbers.length < 2 ? (
              <Caption1 className={styles.muted}>There is only one revision so far.</Caption1>
            ) : (
              <>
                <div className={styles.pickers}>
                  <RevisionSelectField label="From revision" ariaLabel="Compare from revision" numbers={numbers} value={from} onChange={setFrom} />
                  <RevisionSelectField label="To revision" ariaLabel="Compare to revision" numbers={numbers} value={to} onChange={setTo} />
                </div>
                {from === to && <Caption1 className={styles.muted}>Pick two different revisions.</Caption1>}
                {diff.isFetching && <Spinner size="tiny" label="Comparing…" />}
                {diff.isError && (
                  <MessageBar intent="error">
                    <MessageBarBody>{diff.error.message}</MessageBarBody>
                  </MessageBar>
                )}
                {diff.data && from !== to && (
                  <DesignChangesTable
                    changes={diff.data.changes.map(describeChange)}
                    beforeLabel={`Revision ${diff.data.from}`}
                    afterLabel={`Revision ${diff.data.to}`}
                    testId="revision-diff"
                  />
                )}
              </>
            )}
          </section>
        </div>

        <div className={styles.column}>
          <section className={styles.card} aria-labelledby="review-heading">
            <Subtitle2 as="h2" id="review-heading">
              Review
            </Subtitle2>
            <ReviewActions
              linkId={linkId}
              revision={link.data.revision}
              status={link.data.status}
              role={role}
              isAuthor={link.data.author.id === me?.user.id}
              archived={link.data.archived}
            />
            {reviews.isPending && <Spinner size="tiny" />}
            {reviews.isError && (
              <MessageBar intent="error">
                <MessageBarBody>{reviews.error.message}</MessageBarBody>
              </MessageBar>
            )}
            {reviews.data && <ReviewTrail entries={reviews.data} />}
          </section>
        </div>
      </div>
    </>
  );
}

export const createLoader = linkPageLoader;
export const Component = LinkHistoryRoute;

interface RevisionSelectFieldProps {
  label: string;
  ariaLabel: string;
  numbers: readonly number[];
  value: number | null | undefined;
  onChange: (revision: number) => void;
}

function RevisionSelectField({ label, ariaLabel, numbers, value, onChange }: RevisionSelectFieldProps) {
  return (
    <Field label={label}>
      <Select value={String(value ?? '')} onChange={(_, data) => onChange(Number(data.value))} aria-label={ariaLabel}>
        {numbers.map((number) => (
          <option key={number} value={number}>
            {number}
          </option>
        ))}
      </Select>
    </Field>
  );
}
