import { Spinner } from '@fluentui/react-components';

// Being built (issue 4): the route exists so that the router and links resolve.
export function Component() {
  return <Spinner label="This page is being built" />;
}
