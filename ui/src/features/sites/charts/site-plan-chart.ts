// The site plan: the organisation's sites in local east/north metres around their middle, every
// link drawn between its two ends in its margin verdict's colour and line style, a scale bar and
// a north arrow. No map tiles: the product works offline. Pure option builder (no echarts import).
import { enuVector } from '@beamwright/link-core/physics';
import type { LinkSummary, SiteResponse } from '@beamwright/link-core/contracts';
import { MARGIN_VERDICT_TEXT, marginVerdict, type MarginVerdict } from '@/components/ui/margin-verdict';
import type { ChartOption } from '@/components/charts/echart';
import { CHART_TEXT, axisStyle, type ChartMode } from '@/components/charts/chart-theme';
import { round, type ChartData } from '@/components/charts/chart-format';

/** Room around the square plot for the legend (top) and the axis names (bottom, sides) [CSS px]. */
export const SITE_PLAN_MARGIN_PX = { top: 40, bottom: 56, sides: 64 } as const;

export interface PlanSite {
  id: string;
  name: string;
  eastM: number;
  northM: number;
}

export interface PlanLink {
  id: string;
  name: string;
  verdict: MarginVerdict;
  linkMarginDb: number;
  from: PlanSite;
  to: PlanSite;
}

export interface SitePlan {
  sites: PlanSite[];
  links: PlanLink[];
  /** links with a site missing at one end (not drawn) */
  unplacedLinks: number;
  /** half the side of the square the plan shows [m] */
  halfSpanM: number;
  /** the scale bar's length [m], a round number about a fifth of the side */
  scaleBarM: number;
}

/**
 * Places the sites in the local east-north-up frame of their middle point (mean latitude and
 * longitude, at height 0 so the plan is level): link-core's `enuVector`, Hofmann-Wellenhof et al.
 * (2008) §10.2.3. Over a town the frame's curvature error is far below a drawn pixel.
 */
export function sitePlanOf(sites: readonly SiteResponse[], links: readonly LinkSummary[]): SitePlan {
  const origin = {
    latDeg: sites.reduce((sum, site) => sum + site.latitudeDeg, 0) / Math.max(1, sites.length),
    lonDeg: sites.reduce((sum, site) => sum + site.longitudeDeg, 0) / Math.max(1, sites.length),
    heightM: 0,
  };
  const placed: PlanSite[] = sites.map((site) => {
    const enu = enuVector(origin, { latDeg: site.latitudeDeg, lonDeg: site.longitudeDeg, heightM: 0 });
    return { id: site.id, name: site.name, eastM: enu.eastM, northM: enu.northM };
  });
  const byId = new Map(placed.map((site) => [site.id, site]));
  const planLinks: PlanLink[] = [];
  let unplacedLinks = 0;
  for (const link of links) {
    const from = link.siteA ? byId.get(link.siteA.id) : undefined;
    const to = link.siteB ? byId.get(link.siteB.id) : undefined;
    if (!from || !to) {
      unplacedLinks += 1;
      continue;
    }
    planLinks.push({ id: link.id, name: link.name, verdict: marginVerdict(link.linkMarginDb), linkMarginDb: link.linkMarginDb, from, to });
  }
  const reach = Math.max(100, ...placed.map((site) => Math.max(Math.abs(site.eastM), Math.abs(site.northM))));
  const halfSpanM = reach * 1.2;
  return { sites: placed, links: planLinks, unplacedLinks, halfSpanM, scaleBarM: roundScale((2 * halfSpanM) / 5) };
}

/** The largest 1, 2 or 5 × 10ⁿ metres not above `valueM`. */
export function roundScale(valueM: number): number {
  const power = 10 ** Math.floor(Math.log10(valueM));
  return ([5, 2, 1].find((factor) => factor * power <= valueM) ?? 1) * power;
}

export function formatScale(valueM: number): string {
  return valueM >= 1000 ? `${valueM / 1000} km` : `${valueM} m`;
}

/** Verdict colours paired with a line style, so the plan never speaks by colour alone. */
export const VERDICT_LINE: Record<MarginVerdict, { light: string; dark: string; type: 'solid' | 'dashed' | 'dotted'; width: number }> = {
  adequate: { light: '#107c10', dark: '#54b054', type: 'solid', width: 3 },
  thin: { light: '#b25f00', dark: '#f2a33a', type: 'dashed', width: 3 },
  fails: { light: '#c50f1f', dark: '#f1707b', type: 'dotted', width: 4 },
};

/** The plan's values as a table: each site's position, then each link with its verdict in words. */
export function sitePlanData(plan: SitePlan): ChartData {
  return {
    columns: ['Site or link', 'East (m)', 'North (m)', 'Margin verdict'],
    rows: [
      ...plan.sites.map((site) => [site.name, Math.round(site.eastM), Math.round(site.northM), '—']),
      ...plan.links.map((link) => [`${link.name} (${link.from.name} ↔ ${link.to.name})`, '—', '—', `${MARGIN_VERDICT_TEXT[link.verdict]}, ${round(link.linkMarginDb, 1)} dB`]),
    ],
  };
}

/** The plan drawn in a square of `sidePx` CSS pixels, so a metre east is as long as a metre north. */
export function sitePlanOption(plan: SitePlan, mode: ChartMode, sidePx: number, highlightSiteId?: string): ChartOption {
  const colours = CHART_TEXT[mode];
  const half = plan.halfSpanM;
  const axis = (name: string) => ({
    type: 'value',
    name,
    nameLocation: 'middle',
    nameGap: 32,
    min: -half,
    max: half,
    ...axisStyle(mode),
    axisLabel: { color: colours.text, formatter: (value: number) => (Math.abs(value) >= 1000 ? `${round(value / 1000, 1)} km` : `${round(value, 0)} m`) },
  });
  // scale bar and north arrow in the plan's own metres, bottom left and top right
  const barY = -half * 0.86;
  const barX = -half * 0.9;
  const arrowX = half * 0.86;
  const arrowBase = half * 0.62;
  const arrowTip = half * 0.86;
  const verdicts = (['adequate', 'thin', 'fails'] as const).filter((verdict) => plan.links.some((link) => link.verdict === verdict));
  return {
    grid: { left: 'center', top: SITE_PLAN_MARGIN_PX.top, width: sidePx, height: sidePx },
    xAxis: axis('East'),
    yAxis: axis('North'),
    legend: { top: 0, textStyle: { color: colours.text }, data: verdicts.map((verdict) => MARGIN_VERDICT_TEXT[verdict]) },
    tooltip: { trigger: 'item', confine: true },
    series: [
      // one series per verdict, its links separated by gaps (null points), so the legend names the verdict
      ...verdicts.map((verdict) => ({
        type: 'line',
        name: MARGIN_VERDICT_TEXT[verdict],
        id: `verdict-${verdict}`,
        connectNulls: false,
        symbol: 'none',
        lineStyle: { color: VERDICT_LINE[verdict][mode], type: VERDICT_LINE[verdict].type, width: VERDICT_LINE[verdict].width },
        itemStyle: { color: VERDICT_LINE[verdict][mode] },
        emphasis: { focus: 'series', lineStyle: { width: VERDICT_LINE[verdict].width + 2 } },
        triggerLineEvent: true,
        data: plan.links
          .filter((link) => link.verdict === verdict)
          .flatMap((link) => [
            { value: [link.from.eastM, link.from.northM], linkId: link.id, name: link.name },
            { value: [link.to.eastM, link.to.northM], linkId: link.id, name: link.name },
            { value: [null, null] },
          ]),
        tooltip: { formatter: () => `${MARGIN_VERDICT_TEXT[verdict]} margin` },
      })),
      ...plan.links.map((link) => ({
        // an invisible, wide line per link: what a click lands on, to open the link
        type: 'line',
        id: `link-${link.id}`,
        name: link.name,
        symbol: 'none',
        silent: false,
        triggerLineEvent: true,
        lineStyle: { width: 14, opacity: 0 },
        tooltip: { formatter: `${escapeLabel(link.name)}: ${MARGIN_VERDICT_TEXT[link.verdict]} (${round(link.linkMarginDb, 1)} dB). Click to open.` },
        data: [
          [link.from.eastM, link.from.northM],
          [link.to.eastM, link.to.northM],
        ],
      })),
      {
        type: 'scatter',
        name: 'Sites',
        id: 'sites',
        symbolSize: 12,
        itemStyle: { color: mode === 'dark' ? '#7cc7d6' : '#0a5866', borderColor: colours.surface, borderWidth: 2 },
        label: { show: true, position: 'right', color: colours.text, formatter: (params: { data: { name: string } }) => params.data.name },
        data: plan.sites.map((site) => ({
          name: site.name,
          value: [site.eastM, site.northM],
          symbolSize: site.id === highlightSiteId ? 18 : 12,
        })),
        tooltip: { formatter: (params: { data: { name: string; value: number[] } }) => `${escapeLabel(params.data.name)}: ${round(params.data.value[0]!, 0)} m east, ${round(params.data.value[1]!, 0)} m north` },
        z: 5,
      },
      {
        type: 'line',
        name: 'Scale',
        id: 'scale-bar',
        silent: true,
        symbol: 'rect',
        symbolSize: [2, 10],
        lineStyle: { color: colours.text, width: 2 },
        itemStyle: { color: colours.text },
        label: { show: false },
        endLabel: { show: true, color: colours.text, formatter: formatScale(plan.scaleBarM) },
        data: [
          [barX, barY],
          [barX + plan.scaleBarM, barY],
        ],
        tooltip: { show: false },
      },
      {
        type: 'line',
        name: 'North',
        id: 'north-arrow',
        silent: true,
        symbol: ['none', 'arrow'],
        symbolSize: 12,
        lineStyle: { color: colours.text, width: 2 },
        itemStyle: { color: colours.text },
        endLabel: { show: true, color: colours.text, formatter: 'N', offset: [-4, -14] },
        data: [
          [arrowX, arrowBase],
          [arrowX, arrowTip],
        ],
        tooltip: { show: false },
      },
    ],
  };
}

function escapeLabel(text: string): string {
  return text.replace(/[&<>"']/g, (character) => `&#${character.charCodeAt(0)};`);
}
