import { Badge } from '@fluentui/react-components';
import { CheckmarkStarburstRegular, EditRegular, EyeRegular, PlugConnectedRegular, QuestionCircleRegular } from '@fluentui/react-icons';
import type { ReactElement } from 'react';
import { LINK_STATUS_LABELS } from '@beamwright/link-core/contracts';

type BadgeColor = 'informative' | 'warning' | 'success' | 'brand' | 'subtle';

const STATUS_LOOK: Record<string, { label: string; color: BadgeColor; icon: ReactElement }> = {
  draft: { label: LINK_STATUS_LABELS.draft, color: 'informative', icon: <EditRegular /> },
  inreview: { label: LINK_STATUS_LABELS.in_review, color: 'warning', icon: <EyeRegular /> },
  approved: { label: LINK_STATUS_LABELS.approved, color: 'success', icon: <CheckmarkStarburstRegular /> },
  installed: { label: LINK_STATUS_LABELS.installed, color: 'brand', icon: <PlugConnectedRegular /> },
};

/** 'in_review', 'in-review' and 'in review' are the same state. */
export function normaliseStatus(status: string): string {
  return status.toLowerCase().replace(/[\s_-]/g, '');
}

export function LinkStatusBadge({ status }: { status: string }) {
  const look = STATUS_LOOK[normaliseStatus(status)] ?? { label: status, color: 'subtle' as const, icon: <QuestionCircleRegular /> };
  return (
    <Badge appearance="tint" color={look.color} icon={look.icon} data-status={normaliseStatus(status)}>
      {look.label}
    </Badge>
  );
}
