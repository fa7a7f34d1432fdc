import { Badge } from '@fluentui/react-components';
import { CheckmarkStarburstRegular, EditRegular, EyeRegular, PlugConnectedRegular, QuestionCircleRegular } from '@fluentui/react-icons';
import type { ReactElement } from 'react';

type BadgeColor = 'informative' | 'warning' | 'success' | 'brand' | 'subtle';

const STATUS_LOOK: Record<string, { label: string; color: BadgeColor; icon: ReactElement }> = {
  draft: { label: 'Draft', color: 'informative', icon: <EditRegular /> },
  inreview: { label: 'In review', color: 'warning', icon: <EyeRegular /> },
  approved: { label: 'Approved', color: 'success', icon: <CheckmarkStarburstRegular /> },
  installed: { label: 'Installed', color: 'brand', icon: <PlugConnectedRegular /> },
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
