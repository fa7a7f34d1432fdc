import type { ReactNode } from 'react';
import { Link as RouterLink } from 'react-router-dom';
import { Caption1, Title2, makeStyles, tokens } from '@fluentui/react-components';
import { ChevronRightRegular } from '@fluentui/react-icons';
import { paths } from '@/config/paths';
import { formatDateTime, formatDb } from '@/lib/format';
import { LinkStatusBadge } from '@/features/links/components/link-status-badge';
import { LinkFlags } from '@/features/links/components/link-flags';
import { LinkLifecycleActions } from '@/features/links/components/link-lifecycle-actions';
import type { LinkDetail } from '@beamwright/link-core/contracts';

const useStyles = makeStyles({
  root: { display: 'flex', flexWrap: 'wrap', alignItems: 'flex-end', justifyContent: 'space-between', columnGap: tokens.spacingHorizontalL, rowGap: tokens.spacingVerticalS, marginBottom: tokens.spacingVerticalL },
  crumbs: { display: 'flex', alignItems: 'center', columnGap: tokens.spacingHorizontalXS, color: tokens.colorNeutralForeground3 },
  crumbLink: { color: tokens.colorBrandForeground1 },
  titleRow: { display: 'flex', alignItems: 'center', columnGap: tokens.spacingHorizontalM, flexWrap: 'wrap' },
  meta: { color: tokens.colorNeutralForeground3 },
  warning: { color: tokens.colorPaletteRedForeground1, margin: 0, maxWidth: '70ch' },
  engine: { display: 'block', color: tokens.colorNeutralForeground2 },
  engineBelow: { display: 'block', color: tokens.colorPaletteDarkOrangeForeground1 },
  actions: { display: 'flex', columnGap: tokens.spacingHorizontalS, rowGap: tokens.spacingVerticalS, flexWrap: 'wrap' },
});

export function LinkHeader({ link, section, actions }: { link: LinkDetail; section?: string; actions?: ReactNode }) {
  const styles = useStyles();
  const ends = link.siteA || link.siteB ? `${link.siteA?.name ?? '—'} ↔ ${link.siteB?.name ?? '—'} · ` : '';
  return (
    <div className={styles.root}>
      <div>
        <nav className={styles.crumbs} aria-label="Breadcrumb">
          <RouterLink className={styles.crumbLink} to={paths.app.links.getHref()}>
            Links
          </RouterLink>
          <ChevronRightRegular aria-hidden />
          {section ? (
            <>
              <RouterLink className={styles.crumbLink} to={paths.app.link.getHref(link.id)}>
                {link.name}
              </RouterLink>
              <ChevronRightRegular aria-hidden />
              <span>{section}</span>
            </>
          ) : (
            <span>{link.name}</span>
          )}
        </nav>
        <div className={styles.titleRow}>
          <Title2 as="h1">{section ?? link.name}</Title2>
          <LinkStatusBadge status={link.status} />
          <LinkFlags link={link} />
        </div>
        <Caption1 className={styles.meta} data-testid="revision-meta">
          {ends}Revision {link.revision} by {link.author.displayName}, {formatDateTime(link.revisedAt)}
          {link.approval ? ` · approved by ${link.approval.by.displayName}` : ''}
          {link.archivedAt ? ` · archived ${formatDateTime(link.archivedAt)}, read-only until restored` : ''}
        </Caption1>
        {link.pathChangedAt && (
          <Caption1 as="p" className={styles.warning} data-testid="path-changed-note">
            A site of this link moved or changed height on {formatDateTime(link.pathChangedAt)}, after its approval: the approval does not cover
            the path as it is now. Save a revision and have it reviewed again.
          </Caption1>
        )}
        {link.currentEngine && (
          // A revision computed by an older engine keeps its stored figures; the current engine's margin goes beside them.
          <Caption1
            className={link.currentEngine.belowRequiredMargin && (link.status === 'approved' || link.status === 'installed') ? styles.engineBelow : styles.engine}
            data-testid="engine-comparison"
          >
            Computed by engine {link.linkCoreVersion}: margin {formatDb(link.linkMarginDb, { digits: 2 })}. Engine {link.currentEngine.linkCoreVersion} gives{' '}
            {formatDb(link.currentEngine.linkMarginDb, { digits: 2 })} ({formatDb(link.currentEngine.marginChangeDb, { digits: 2, signed: true })}).
            {link.currentEngine.belowRequiredMargin ? ' Below the required 3 dB with the current engine.' : ''}
          </Caption1>
        )}
      </div>
      <div className={styles.actions}>
        {actions}
        <LinkLifecycleActions link={link} />
      </div>
    </div>
  );
}
