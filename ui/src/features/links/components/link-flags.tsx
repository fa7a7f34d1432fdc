import { Badge } from '@fluentui/react-components';
import { ArchiveRegular, LocationRegular } from '@fluentui/react-icons';
import type { LinkSummary } from '@beamwright/link-core/contracts';

/**
 * The marks beside a link's status: "Changed since approval" when a site under an approved or
 * installed link moved after the approval, and "Archived". Each is a word with an icon, never
 * colour alone.
 */
export function LinkFlags({ link }: { link: Pick<LinkSummary, 'changedSinceApproval' | 'archived'> }) {
  return (
    <>
      {link.changedSinceApproval && (
        <Badge appearance="outline" color="danger" icon={<LocationRegular />} data-testid="changed-since-approval">
          Changed since approval
        </Badge>
      )}
      {link.archived && (
        <Badge appearance="outline" color="subtle" icon={<ArchiveRegular />} data-testid="archived-flag">
          Archived
        </Badge>
      )}
    </>
  );
}
