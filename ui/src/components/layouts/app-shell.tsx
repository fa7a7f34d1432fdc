import { NavLink, Outlet } from 'react-router-dom';
import {
  Avatar,
  Badge,
  Button,
  Text,
  Tooltip,
  makeStyles,
  mergeClasses,
  shorthands,
  tokens,
} from '@fluentui/react-components';
import { SignOutRegular, WeatherMoonRegular, WeatherSunnyRegular } from '@fluentui/react-icons';
import { isAllowed } from '@beamwright/link-core/contracts';
import { paths } from '@/config/paths';
import { ROLE_LABELS, useCurrentUser, useSignOut } from '@/lib/auth';
import { useThemeMode } from '@/lib/theme';
import { BrandMark } from '@/components/layouts/brand-mark';

const useStyles = makeStyles({
  shell: { minHeight: '100vh', display: 'flex', flexDirection: 'column' },
  header: {
    display: 'flex',
    alignItems: 'center',
    columnGap: tokens.spacingHorizontalL,
    paddingInline: tokens.spacingHorizontalXL,
    minHeight: '56px',
    backgroundColor: '#0a2f38',
    color: '#e6f4f6',
    boxShadow: tokens.shadow4,
    position: 'sticky',
    top: 0,
    zIndex: 10,
    // Reflow (WCAG 1.4.10): on a narrow screen the header wraps onto a second line and scrolls away.
    flexWrap: 'wrap',
    rowGap: tokens.spacingVerticalXS,
    '@media (max-width: 640px)': {
      position: 'static',
      paddingInline: tokens.spacingHorizontalM,
      paddingBlock: tokens.spacingVerticalS,
      columnGap: tokens.spacingHorizontalS,
    },
  },
  brand: {
    display: 'flex',
    alignItems: 'center',
    columnGap: tokens.spacingHorizontalS,
    color: 'inherit',
    textDecorationLine: 'none',
    fontWeight: tokens.fontWeightBold,
    fontSize: tokens.fontSizeBase400,
    letterSpacing: '0.02em',
  },
  nav: {
    display: 'flex',
    flexWrap: 'wrap',
    columnGap: tokens.spacingHorizontalXS,
    marginInlineStart: tokens.spacingHorizontalL,
    '@media (max-width: 640px)': { marginInlineStart: 0 },
  },
  navLink: {
    color: '#b7dfe7',
    textDecorationLine: 'none',
    paddingBlock: tokens.spacingVerticalS,
    paddingInline: tokens.spacingHorizontalM,
    borderRadius: tokens.borderRadiusMedium,
    fontWeight: tokens.fontWeightSemibold,
    ':hover': { backgroundColor: 'rgba(255,255,255,0.08)', color: '#ffffff' },
  },
  navLinkActive: {
    color: '#ffffff',
    backgroundColor: 'rgba(255,255,255,0.12)',
    boxShadow: 'inset 0 -2px 0 #e8a33d',
  },
  spacer: { flexGrow: 1 },
  user: { display: 'flex', alignItems: 'center', columnGap: tokens.spacingHorizontalS },
  userText: {
    display: 'flex',
    flexDirection: 'column',
    lineHeight: tokens.lineHeightBase200,
    // the avatar keeps the name (as its label) when there is no room for the text
    '@media (max-width: 640px)': { display: 'none' },
  },
  userName: { color: '#ffffff', fontWeight: tokens.fontWeightSemibold },
  userOrg: { color: '#b7dfe7', fontSize: tokens.fontSizeBase200 },
  headerButton: {
    color: '#e6f4f6',
    ':hover': { color: '#ffffff', backgroundColor: 'rgba(255,255,255,0.1)' },
    ':hover:active': { color: '#ffffff', backgroundColor: 'rgba(255,255,255,0.16)' },
  },
  roleBadge: { ...shorthands.borderColor('#58b2c2') },
  main: {
    flexGrow: 1,
    width: '100%',
    maxWidth: '1600px',
    marginInline: 'auto',
    boxSizing: 'border-box',
    paddingBlock: tokens.spacingVerticalXL,
    paddingInline: tokens.spacingHorizontalXXL,
    '@media (max-width: 640px)': { paddingInline: tokens.spacingHorizontalM },
  },
});

export function AppShell() {
  const styles = useStyles();
  const currentUser = useCurrentUser();
  const signOut = useSignOut();
  const [mode, setMode] = useThemeMode();
  const me = currentUser.data;

  return (
    <div className={styles.shell}>
      <header className={styles.header}>
        <NavLink to={paths.app.links.getHref()} className={styles.brand} aria-label="Beamwright home">
          <BrandMark size={28} />
          Beamwright
        </NavLink>
        <nav className={styles.nav} aria-label="Main">
          <NavLink
            to={paths.app.links.getHref()}
            className={({ isActive }) => mergeClasses(styles.navLink, isActive && styles.navLinkActive)}
          >
            Links
          </NavLink>
          <NavLink to={paths.app.sites.getHref()} className={({ isActive }) => mergeClasses(styles.navLink, isActive && styles.navLinkActive)}>
            Sites
          </NavLink>
          {isAllowed(me?.role, 'organisation.settings') && (
            <NavLink to={paths.app.settings.getHref()} className={({ isActive }) => mergeClasses(styles.navLink, isActive && styles.navLinkActive)}>
              Settings
            </NavLink>
          )}
          <NavLink
            to={paths.app.weatherDatasets.getHref()}
            className={({ isActive }) => mergeClasses(styles.navLink, isActive && styles.navLinkActive)}
          >
            Weather data
          </NavLink>
        </nav>
        <div className={styles.spacer} />
        <Tooltip content={mode === 'dark' ? 'Switch to the light theme' : 'Switch to the dark theme'} relationship="label">
          <Button
            appearance="subtle"
            className={styles.headerButton}
            icon={mode === 'dark' ? <WeatherSunnyRegular /> : <WeatherMoonRegular />}
            onClick={() => setMode(mode === 'dark' ? 'light' : 'dark')}
            data-testid="theme-toggle"
          />
        </Tooltip>
        {me && (
          <div className={styles.user} data-testid="current-user">
            <Avatar name={me.user.displayName} size={32} color="colorful" />
            <div className={styles.userText}>
              <Text className={styles.userName}>{me.user.displayName}</Text>
              <Text className={styles.userOrg}>{me.organisation.name}</Text>
            </div>
            <Badge appearance="outline" className={styles.roleBadge} style={{ color: '#e6f4f6' }} data-testid="current-role">
              {ROLE_LABELS[me.role] ?? me.role}
            </Badge>
          </div>
        )}
        <Button appearance="subtle" className={styles.headerButton} icon={<SignOutRegular />} onClick={signOut}>
          Sign out
        </Button>
      </header>
      <main className={styles.main}>
        <Outlet />
      </main>
    </div>
  );
}
