import { useState } from 'react';
import { Navigate } from 'react-router-dom';
import type { QueryClient } from '@tanstack/react-query';
import { Body1, Card, MessageBar, MessageBarBody, Skeleton, SkeletonItem, Title2, makeStyles, tokens } from '@fluentui/react-components';
import { isAllowed } from '@beamwright/link-core/contracts';
import { paths } from '@/config/paths';
import { useCurrentUser } from '@/lib/auth';
import { getOrganisationSettingsQueryOptions, useOrganisationSettings } from '@/features/organisation-settings/api/get-organisation-settings';
import { useUpdateOrganisationSettings } from '@/features/organisation-settings/api/update-organisation-settings';
import { OrganisationSettingsForm } from '@/features/organisation-settings/components/organisation-settings-form';

const useStyles = makeStyles({
  page: { display: 'grid', rowGap: tokens.spacingVerticalL },
  muted: { color: tokens.colorNeutralForeground3 },
  card: { padding: tokens.spacingHorizontalXXL, maxWidth: '720px' },
});

export function OrganisationSettingsRoute() {
  const styles = useStyles();
  const role = useCurrentUser().data?.role;
  const settings = useOrganisationSettings();
  const update = useUpdateOrganisationSettings();
  const [saved, setSaved] = useState(false);
  if (role && !isAllowed(role, 'organisation.settings')) return <Navigate to={paths.app.links.getHref()} replace />;
  return (
    <div className={styles.page}>
      <div>
        <Title2 as="h1">Organisation settings</Title2>
        <div>
          <Body1 className={styles.muted}>The organisation&apos;s name and the figures every new link starts from. Existing links keep their own.</Body1>
        </div>
      </div>
      {settings.isError && (
        <MessageBar intent="error">
          <MessageBarBody>The settings could not be loaded: {settings.error.message}</MessageBarBody>
        </MessageBar>
      )}
      {settings.isPending && (
        <Skeleton aria-label="Loading the settings">
          <SkeletonItem size={32} />
        </Skeleton>
      )}
      {settings.data && (
        <Card className={styles.card}>
          <OrganisationSettingsForm
            key={`${settings.data.name}|${settings.data.requiredMarginDb}|${settings.data.fadeProbability}|${settings.data.visibilityDefinition}|${settings.data.distanceUnit}`}
            settings={settings.data}
            pending={update.isPending}
            saved={saved}
            onSubmit={(changes, handlers) => {
              setSaved(false);
              update.mutate(changes, { onSuccess: () => setSaved(true), onError: handlers.onError });
            }}
          />
        </Card>
      )}
    </div>
  );
}

export const createLoader = (queryClient: QueryClient) => () => {
  void queryClient.prefetchQuery(getOrganisationSettingsQueryOptions());
  return null;
};

export const Component = OrganisationSettingsRoute;
