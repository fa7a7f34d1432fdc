import { Link as RouterLink } from 'react-router-dom';
import { Button, Skeleton, SkeletonItem } from '@fluentui/react-components';
import { HistoryRegular } from '@fluentui/react-icons';
import { paths } from '@/config/paths';
import { policies, useCurrentUser } from '@/lib/auth';
import { ErrorView } from '@/components/errors/route-error';
import { useLink } from '@/features/links/api/get-link';
import { LinkHeader } from '@/features/links/components/link-header';
import { DesignReadout } from '@/features/link-design/components/design-readout';
import { DesignResults } from '@/features/link-design/components/design-results';
import { DesignEditor } from '@/app/routes/links/design-editor';
import { REQUIRED_LINK_MARGIN_DB } from '@beamwright/link-core';
import type { LinkDetail } from '@beamwright/link-core/contracts';
import { ResultsTabs } from '@/app/routes/links/results-tabs';
import { MarginExplorer } from '@/features/explore/components/margin-explorer';
import { AlternativesPanel } from '@/features/variants/components/alternatives-panel';
import { useWorkspaceStyles } from '@/app/routes/links/workspace-layout';
import { SitePathSummary } from '@/features/sites/components/site-path-summary';
import { ReviewActions } from '@/features/reviews/components/review-actions';
import type { Role } from '@beamwright/link-core/contracts';
import { linkPageLoader, useLinkIdParam } from '@/app/routes/links/link-route-params';

function HistoryButton({ linkId }: { linkId: string }) {
  return (
    <RouterLink to={paths.app.linkHistory.getHref(linkId)} tabIndex={-1}>
      <Button icon={<HistoryRegular />}>History and review</Button>
    </RouterLink>
  );
}

/** Installers, reviewers and admins read the stored design, as does everyone on an archived link: no inputs, no save. */
function DesignViewer({ link, role, userId }: { link: LinkDetail; role: Role | undefined; userId: string | undefined }) {
  const styles = useWorkspaceStyles();
  return (
    <>
      <LinkHeader
        link={link}
        actions={
          <>
            <HistoryButton linkId={link.id} />
            <ReviewActions linkId={link.id} revision={link.revision} status={link.status} role={role} isAuthor={link.author.id === userId} archived={link.archived} />
          </>
        }
      />
      <div className={styles.layout}>
        <div style={{ display: 'grid', rowGap: 12 }}>
          <SitePathSummary siteAId={link.siteA?.id} siteBId={link.siteB?.id} designRangeM={link.design.rangeM} />
          <DesignReadout design={link.design} />
        </div>
        <div className={styles.results}>
          <ResultsTabs
            alternativesCount={link.variants?.length}
            views={{
              budget: <DesignResults design={link.design} budget={link.budget} />,
              explore: <MarginExplorer design={link.design} requiredMarginDb={REQUIRED_LINK_MARGIN_DB} />,
              alternatives: (
                <AlternativesPanel
                  primaryDesign={link.design}
                  primaryLabel={`Revision ${link.revision}`}
                  requiredMarginDb={REQUIRED_LINK_MARGIN_DB}
                  variants={(link.variants ?? []).map((variant) => ({ id: String(variant.index), name: variant.name, design: variant.design }))}
                />
              ),
            }}
          />
        </div>
      </div>
    </>
  );
}

export function LinkWorkspaceRoute() {
  const linkId = useLinkIdParam();
  const link = useLink(linkId);
  const me = useCurrentUser().data;
  const role = me?.role;

  if (link.isPending) {
    return (
      <Skeleton aria-label="Loading the link">
        <SkeletonItem size={40} style={{ width: '40%', marginBottom: 16 }} />
        <SkeletonItem style={{ height: 480 }} />
      </Skeleton>
    );
  }
  if (link.isError) return <ErrorView error={link.error} />;
  // an archived link is read-only, for engineers too, until it is restored
  if (!policies.canEditDesigns(role) || link.data.archived) return <DesignViewer link={link.data} role={role} userId={me?.user.id} />;
  return <DesignEditor key={link.data.id} link={link.data} historyAction={<HistoryButton linkId={link.data.id} />} />;
}

export const createLoader = linkPageLoader;
export const Component = LinkWorkspaceRoute;
