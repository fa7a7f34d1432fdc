import { useEffect, useMemo, useRef, useState } from 'react';
import { Link as RouterLink, useNavigate } from 'react-router-dom';
import {
  Caption1,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import type { LinkSummary, SiteResponse } from '@beamwright/link-core/contracts';
import { paths } from '@/config/paths';
import { useThemeMode } from '@/lib/theme';
import { ChartCard } from '@/components/charts/chart-card';
import { LazyEChart } from '@/components/charts/lazy-echart';
import { MarginBadge } from '@/components/ui/margin-verdict';
import { SITE_PLAN_MARGIN_PX, formatScale, sitePlanData, sitePlanOf, sitePlanOption } from '@/features/sites/charts/site-plan-chart';
import { linkTextStyle } from '@/components/ui/link-text-style';

const useStyles = makeStyles({
  layout: {
    display: 'grid',
    gridTemplateColumns: 'repeat(auto-fit, minmax(min(360px, 100%), 1fr))',
    gap: tokens.spacingHorizontalL,
    alignItems: 'start',
  },
  measure: { minWidth: 0 },
  linkName: linkTextStyle,
  ends: { color: tokens.colorNeutralForeground3, fontSize: tokens.fontSizeBase200, display: 'block' },
  tableWrap: { overflowX: 'auto' },
});

const MAX_SIDE_PX = 560;

/** The width of an element, followed as it changes (0 before layout and in jsdom). */
function useElementWidth<Element extends HTMLElement>() {
  const ref = useRef<Element | null>(null);
  const [width, setWidth] = useState(0);
  useEffect(() => {
    const element = ref.current;
    if (!element || typeof ResizeObserver === 'undefined') return;
    const observer = new ResizeObserver(([entry]) => setWidth(Math.round(entry?.contentRect.width ?? 0)));
    observer.observe(element);
    return () => observer.disconnect();
  }, []);
  return [ref, width] as const;
}

export interface SitePlanProps {
  sites: readonly SiteResponse[];
  links: readonly LinkSummary[];
  /** a site drawn larger (the one being edited) */
  highlightSiteId?: string;
}

/**
 * The site plan with, beside it, its links in a table that says each verdict in words; a click on
 * a link in the plan or its name in the table opens it.
 */
export function SitePlan({ sites, links, highlightSiteId }: SitePlanProps) {
  const styles = useStyles();
  const [mode] = useThemeMode();
  const navigate = useNavigate();
  const [measureRef, width] = useElementWidth<HTMLDivElement>();
  const plan = useMemo(() => sitePlanOf(sites, links), [sites, links]);
  // a square plot, so a metre east is drawn as long as a metre north
  const sidePx = Math.max(160, Math.min(MAX_SIDE_PX, (width || 420) - 2 * SITE_PLAN_MARGIN_PX.sides));
  const option = useMemo(() => sitePlanOption(plan, mode, sidePx, highlightSiteId), [plan, mode, sidePx, highlightSiteId]);
  const onEvents = useMemo(
    () => ({
      click: (params: unknown) => {
        const seriesId = (params as { seriesId?: string }).seriesId ?? '';
        if (seriesId.startsWith('link-')) navigate(paths.app.link.getHref(seriesId.slice('link-'.length)));
      },
    }),
    [navigate],
  );
  const title = 'Site plan';
  const ariaLabel = `Site plan: ${plan.sites.length} sites and ${plan.links.length} links in local east and north metres, scale bar ${formatScale(plan.scaleBarM)}, north up. Each link's margin verdict is in the table of links.`;

  return (
    <div className={styles.layout}>
      <div ref={measureRef} className={styles.measure}>
        <ChartCard
          title={title}
          testId="site-plan"
          data={sitePlanData(plan)}
          caption={
            <>
              East and north of the sites&apos; middle point, in metres (north up; no map). Lines: solid = adequate margin, dashed = thin,
              dotted = fails. Click a link to open it.
              {plan.unplacedLinks > 0 && ` ${plan.unplacedLinks} link${plan.unplacedLinks === 1 ? ' has' : 's have'} no site at one end and ${plan.unplacedLinks === 1 ? 'is' : 'are'} not drawn.`}
            </>
          }
        >
          <LazyEChart option={option} ariaLabel={ariaLabel} height={sidePx + SITE_PLAN_MARGIN_PX.top + SITE_PLAN_MARGIN_PX.bottom} testId="site-plan-chart" onEvents={onEvents} />
        </ChartCard>
      </div>
      <div className={styles.tableWrap}>
        <Table size="small" aria-label="Links on the plan" data-testid="site-plan-links">
          <TableHeader>
            <TableRow>
              <TableHeaderCell>Link</TableHeaderCell>
              <TableHeaderCell>Margin verdict</TableHeaderCell>
            </TableRow>
          </TableHeader>
          <TableBody>
            {plan.links.map((link) => (
              <TableRow key={link.id}>
                <TableCell>
                  <RouterLink to={paths.app.link.getHref(link.id)} className={styles.linkName}>
                    {link.name}
                  </RouterLink>
                  <span className={styles.ends}>
                    {link.from.name} ↔ {link.to.name}
                  </span>
                </TableCell>
                <TableCell>
                  <MarginBadge linkMarginDb={link.linkMarginDb} size="small" />
                </TableCell>
              </TableRow>
            ))}
          </TableBody>
        </Table>
        {plan.links.length === 0 && <Caption1>No link joins two sites yet.</Caption1>}
      </div>
    </div>
  );
}
