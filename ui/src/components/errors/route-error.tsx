import { isRouteErrorResponse, Link, useRouteError } from 'react-router-dom';
import { Button, MessageBar, MessageBarBody, MessageBarTitle, makeStyles, tokens } from '@fluentui/react-components';
import { isApiError } from '@/lib/api-client';
import { paths } from '@/config/paths';

const useStyles = makeStyles({
  root: { maxWidth: '720px', marginInline: 'auto', paddingBlock: tokens.spacingVerticalXXL, display: 'grid', rowGap: tokens.spacingVerticalL },
});

function describe(error: unknown): { title: string; detail: string } {
  if (isRouteErrorResponse(error)) {
    return error.status === 404
      ? { title: 'Page not found', detail: 'There is nothing at this address.' }
      : { title: `Error ${error.status}`, detail: error.statusText };
  }
  if (isApiError(error, 404)) return { title: 'Not found', detail: 'This item does not exist or belongs to another organisation.' };
  if (isApiError(error, 403)) return { title: 'Not allowed', detail: 'Your role does not allow this.' };
  if (error instanceof Error) return { title: 'Something went wrong', detail: error.message };
  return { title: 'Something went wrong', detail: 'An unexpected error occurred.' };
}

export function ErrorView({ error }: { error: unknown }) {
  const styles = useStyles();
  const { title, detail } = describe(error);
  return (
    <div className={styles.root} role="alert">
      <MessageBar intent="error" layout="multiline">
        <MessageBarBody>
          <MessageBarTitle>{title}</MessageBarTitle>
          {detail}
        </MessageBarBody>
      </MessageBar>
      <div>
        <Link to={paths.app.links.getHref()}>
          <Button appearance="primary">Back to the links</Button>
        </Link>
      </div>
    </div>
  );
}

export function RouteError() {
  const error = useRouteError();
  return <ErrorView error={error} />;
}
