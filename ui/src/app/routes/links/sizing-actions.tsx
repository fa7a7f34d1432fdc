import type { ReactNode } from 'react';
import { REQUIRED_LINK_MARGIN_DB, type SolveDesignVariable } from '@beamwright/link-core';
import { SizeIt } from '@/features/explore/components/size-it';
import { QUANTITY_FIELDS, type QuantityFieldId } from '@/features/link-design/design-fields';
import { writeQuantity } from '@/features/link-design/design-draft';
import type { DesignWorkspace } from '@/features/link-design/hooks/use-design-workspace';

/** The form field each solver changes. */
const SOLVED_FIELDS: Record<SolveDesignVariable, QuantityFieldId> = {
  rangeM: 'rangeM',
  powerDbm: 'transmitter.powerDbm',
  waistRadiusM: 'transmitter.waistRadiusM',
  halfAngleDivergenceRad: 'transmitter.halfAngleDivergenceRad',
};

/**
 * The "size it for me" actions under the fields they change. A solved beam radius or divergence is
 * a 1/e² radius or half angle, so using it also switches that field's definition to 1/e².
 */
export function sizingActions(workspace: DesignWorkspace): Partial<Record<QuantityFieldId, ReactNode>> {
  const use = (vary: SolveDesignVariable) => (valueSi: number) => {
    if (vary === 'waistRadiusM') workspace.update({ beamSize: { extent: 'radius', definition: '1/e2' } });
    if (vary === 'halfAngleDivergenceRad') workspace.update({ divergence: { extent: 'half', definition: '1/e2' } });
    const field = SOLVED_FIELDS[vary];
    workspace.setText(field, writeQuantity(QUANTITY_FIELDS[field], valueSi));
  };
  return Object.fromEntries(
    (Object.keys(SOLVED_FIELDS) as SolveDesignVariable[]).map((vary) => [
      SOLVED_FIELDS[vary],
      <SizeIt key={vary} vary={vary} design={workspace.design} requiredMarginDb={REQUIRED_LINK_MARGIN_DB} onUse={use(vary)} />,
    ]),
  );
}
