import { Button, Caption1, MessageBar, MessageBarActions, MessageBarBody, makeStyles, tokens } from '@fluentui/react-components';
import { useSitePathGeometry } from '@/features/sites/hooks/use-site-path-geometry';
import { formatDistance } from '@/lib/format';

const useStyles = makeStyles({
  root: { display: 'grid', rowGap: tokens.spacingVerticalXS },
  muted: { color: tokens.colorNeutralForeground3 },
});

// Beyond this relative difference the typed path and the sites' distance tell different stories.
const MISMATCH_FRACTION = 0.01;

function degrees(value: number, signed = false): string {
  const text = value.toFixed(2);
  return `${signed && value > 0 ? '+' : ''}${text.replace('-', '\u2212')}°`;
}

export interface SitePathSummaryProps {
  siteAId: string | null | undefined;
  siteBId: string | null | undefined;
  /** the path length of the design [m] */
  designRangeM: number;
  /** offered when the design and the sites disagree (editors only) */
  onUseRangeM?: (rangeM: number) => void;
}

/** What the two ends' coordinates say: slant range, bearings and elevations, against the design's path. */
export function SitePathSummary({ siteAId, siteBId, designRangeM, onUseRangeM }: SitePathSummaryProps) {
  const styles = useStyles();
  const path = useSitePathGeometry(siteAId, siteBId);

  if (!siteAId || !siteBId || !path) return null;
  const { a, b, geometry: result } = path;
  const mismatch = Math.abs(designRangeM - result.slantRangeM) / result.slantRangeM > MISMATCH_FRACTION;

  return (
    <div className={styles.root} data-testid="site-path">
      <Caption1 className={styles.muted}>
        {a.name} → {b.name}: {formatDistance(result.slantRangeM)} between the terminals; bearing {degrees(result.azimuthAtoBDeg)} (back{' '}
        {degrees(result.azimuthBtoADeg)}), elevation {degrees(result.elevationAtoBDeg, true)} from {a.name}. True north, geometric
        elevation.
      </Caption1>
      {mismatch && (
        <MessageBar intent="warning" layout="multiline">
          <MessageBarBody>
            The design’s path ({formatDistance(designRangeM)}) differs from the sites’ distance ({formatDistance(result.slantRangeM)}).
          </MessageBarBody>
          {onUseRangeM && (
            <MessageBarActions>
              <Button size="small" onClick={() => onUseRangeM(result.slantRangeM)}>
                Use {formatDistance(result.slantRangeM)}
              </Button>
            </MessageBarActions>
          )}
        </MessageBar>
      )}
    </div>
  );
}
