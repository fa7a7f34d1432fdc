import { Subtitle2, makeStyles, tokens } from '@fluentui/react-components';
import type { LinkDesignInput } from '@beamwright/link-core';
import { CHOICE_FIELD_LABELS, SECTION_TITLES, fieldsOfSection, type DesignSection } from '@/features/link-design/design-fields';
import { describeDesignValue } from '@/features/link-design/design-diff';

const useStyles = makeStyles({
  root: { display: 'grid', rowGap: tokens.spacingVerticalL },
  section: {
    padding: tokens.spacingHorizontalL,
    borderRadius: tokens.borderRadiusLarge,
    backgroundColor: tokens.colorNeutralBackground1,
    border: `1px solid ${tokens.colorNeutralStroke2}`,
  },
  title: { color: tokens.colorNeutralForeground2, textTransform: 'uppercase', letterSpacing: '0.06em', fontSize: tokens.fontSizeBase200 },
  list: { display: 'grid', gridTemplateColumns: 'minmax(160px, auto) 1fr', columnGap: tokens.spacingHorizontalL, rowGap: tokens.spacingVerticalXS, margin: 0 },
  term: { color: tokens.colorNeutralForeground3 },
  value: { margin: 0, fontVariantNumeric: 'tabular-nums', fontWeight: tokens.fontWeightSemibold },
});

function read(design: LinkDesignInput, path: string): unknown {
  return path.split('.').reduce<unknown>((value, key) => (value && typeof value === 'object' ? (value as Record<string, unknown>)[key] : undefined), design);
}

const SECTION_CHOICES: Partial<Record<DesignSection, string[]>> = {
  atmosphere: ['atmosphere.model', 'atmosphere.visibilityDefinition', 'scintillation.include'],
};

/** The stored design for people who read it (installers, reviewers): values with units, no inputs. */
export function DesignReadout({ design }: { design: LinkDesignInput }) {
  const styles = useStyles();
  const sections = Object.keys(SECTION_TITLES) as DesignSection[];
  return (
    <div className={styles.root} data-testid="design-readout">
      {sections.map((section) => (
        <section key={section} className={styles.section} aria-label={SECTION_TITLES[section]}>
          <Subtitle2 as="h3" className={styles.title}>
            {SECTION_TITLES[section]}
          </Subtitle2>
          <dl className={styles.list}>
            {(SECTION_CHOICES[section] ?? []).map((path) => (
              <div key={path} style={{ display: 'contents' }}>
                <dt className={styles.term}>{CHOICE_FIELD_LABELS[path]}</dt>
                <dd className={styles.value}>{describeDesignValue(path, read(design, path))}</dd>
              </div>
            ))}
            {fieldsOfSection(section).map((field) => (
              <div key={field.id} style={{ display: 'contents' }}>
                <dt className={styles.term}>{field.label}</dt>
                <dd className={styles.value}>{describeDesignValue(field.id, read(design, field.id))}</dd>
              </div>
            ))}
          </dl>
        </section>
      ))}
    </div>
  );
}
