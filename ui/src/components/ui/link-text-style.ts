// The look of a router link set in running text or a table cell (a name that opens a link or a
// site): link colour, semibold, underlined on hover, and Fluent's focus ring (drawn as an ::after
// box around a positioned element). Spread into a makeStyles rule.
import { createFocusOutlineStyle, tokens } from '@fluentui/react-components';

export const linkTextStyle = {
  color: tokens.colorBrandForegroundLink,
  fontWeight: tokens.fontWeightSemibold,
  textDecorationLine: 'none',
  display: 'inline-flex',
  minHeight: '24px',
  alignItems: 'center',
  position: 'relative',
  borderRadius: tokens.borderRadiusSmall,
  ':hover': { textDecorationLine: 'underline' },
  ...createFocusOutlineStyle(),
} as const;
