import { Link } from 'react-router-dom';
import { Button, Text, Title2, makeStyles, tokens } from '@fluentui/react-components';
import { paths } from '@/config/paths';

const useStyles = makeStyles({ root: { display: 'grid', rowGap: tokens.spacingVerticalM, justifyItems: 'start', paddingBlock: tokens.spacingVerticalXXL } });

export function NotFoundRoute() {
  const styles = useStyles();
  return (
    <div className={styles.root}>
      <Title2 as="h1">Nothing here</Title2>
      <Text>This address does not match any page of Beamwright.</Text>
      <Link to={paths.app.links.getHref()}>
        <Button appearance="primary">Go to the links</Button>
      </Link>
    </div>
  );
}

export const Component = NotFoundRoute;
