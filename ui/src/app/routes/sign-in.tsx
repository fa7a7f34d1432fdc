import { Navigate, useNavigate, useSearchParams } from 'react-router-dom';
import { Caption1, Card, Text, Title2, makeStyles, tokens } from '@fluentui/react-components';
import { SignInForm } from '@/features/auth/components/sign-in-form';
import { BrandMark } from '@/components/layouts/brand-mark';
import { paths } from '@/config/paths';
import { useSessionToken } from '@/lib/auth';

const useStyles = makeStyles({
  page: {
    minHeight: '100vh',
    display: 'grid',
    gridTemplateColumns: 'minmax(0, 5fr) minmax(380px, 4fr)',
    '@media (max-width: 860px)': { gridTemplateColumns: '1fr' },
  },
  story: {
    background: 'linear-gradient(160deg, #06232a 0%, #0c3c47 55%, #0f5766 100%)',
    color: '#e6f4f6',
    padding: '64px',
    display: 'flex',
    flexDirection: 'column',
    justifyContent: 'space-between',
    rowGap: tokens.spacingVerticalXXL,
    '@media (max-width: 860px)': { padding: '32px' },
  },
  brand: { display: 'flex', alignItems: 'center', columnGap: tokens.spacingHorizontalM, fontSize: '22px', fontWeight: 700 },
  claim: { fontSize: '30px', lineHeight: '40px', fontWeight: 600, maxWidth: '30ch', margin: 0 },
  claimNote: { color: '#b7dfe7', maxWidth: '52ch', fontSize: tokens.fontSizeBase400, lineHeight: tokens.lineHeightBase400 },
  beam: { width: '100%', maxWidth: '560px', height: 'auto' },
  formSide: { display: 'grid', placeItems: 'center', padding: tokens.spacingHorizontalXXL },
  card: { width: '100%', maxWidth: '400px', padding: tokens.spacingHorizontalXXL, rowGap: tokens.spacingVerticalL },
  demo: { color: tokens.colorNeutralForeground3 },
});

// A beam leaving one rooftop terminal, passing its waist and widening toward the other.
function BeamIllustration({ className }: { className: string }) {
  return (
    <svg className={className} viewBox="0 0 560 160" role="img" aria-label="A laser beam between two rooftop terminals">
      <rect x="8" y="88" width="60" height="72" fill="#0a2f38" />
      <rect x="492" y="70" width="60" height="90" fill="#0a2f38" />
      <rect x="30" y="70" width="16" height="18" rx="3" fill="#58b2c2" />
      <rect x="514" y="52" width="16" height="18" rx="3" fill="#58b2c2" />
      <path d="M46 73 Q180 76 514 50 L514 72 Q180 84 46 85 Z" fill="#e8a33d" opacity="0.28" />
      <path d="M46 79 L514 61" stroke="#f2b84b" strokeWidth="2" strokeDasharray="6 6" />
    </svg>
  );
}

export function SignInRoute() {
  const styles = useStyles();
  const navigate = useNavigate();
  const [searchParams] = useSearchParams();
  const token = useSessionToken();
  const redirectTo = searchParams.get('redirectTo');
  // Only same-app paths: never bounce a user to another site after signing in.
  const target = redirectTo && redirectTo.startsWith('/') && !redirectTo.startsWith('//') ? redirectTo : paths.app.links.getHref();

  if (token) return <Navigate to={target} replace />;

  return (
    <div className={styles.page}>
      <section className={styles.story} aria-label="About Beamwright">
        <div className={styles.brand}>
          <BrandMark size={36} />
          Beamwright
        </div>
        <div>
          <p className={styles.claim}>Size the link, prove the margin, hand it to the roof.</p>
          <p className={styles.claimNote}>
            Free-space optical link design for engineers, reviewers and installers: beam, budget, weather and eye safety in one
            place.
          </p>
        </div>
        <BeamIllustration className={styles.beam} />
      </section>
      <section className={styles.formSide}>
        <Card className={styles.card}>
          <div>
            <Title2 as="h1">Sign in</Title2>
            <div>
              <Text>Use the account your organisation gave you.</Text>
            </div>
          </div>
          <SignInForm onSignedIn={() => navigate(target, { replace: true })} />
          <Caption1 className={styles.demo}>
            Demo accounts: admin@, engineer@, reviewer@ and installer@demo.test. The password is printed by <code>npm start</code>.
          </Caption1>
        </Card>
      </section>
    </div>
  );
}

export const Component = SignInRoute;
