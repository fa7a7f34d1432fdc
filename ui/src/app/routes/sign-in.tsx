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

// A beam leaving one rooftop terminal, narrow at its waist, widening toward the other roof.
function BeamIllustration({ className }: { className: string }) {
  const windows = (x: number, y: number, columns: number, rows: number) =>
    Array.from({ length: columns * rows }, (_, index) => (
      <rect key={index} x={x + (index % columns) * 12} y={y + Math.floor(index / columns) * 14} width="5" height="7" fill="#3ca3b5" opacity={(index * 7) % 5 === 0 ? 0.55 : 0.18} />
    ));
  return (
    <svg className={className} viewBox="0 0 560 190" role="img" aria-label="A laser beam crossing between two rooftop terminals">
      <defs>
        <linearGradient id="beam-fill" x1="0" x2="1" y1="0" y2="0">
          <stop offset="0" stopColor="#f2b84b" stopOpacity="0.75" />
          <stop offset="1" stopColor="#f2b84b" stopOpacity="0.2" />
        </linearGradient>
      </defs>
      <rect x="150" y="120" width="70" height="70" fill="#0b3540" />
      <rect x="236" y="104" width="48" height="86" fill="#0a313b" />
      <rect x="300" y="132" width="90" height="58" fill="#0b3540" />
      <rect x="402" y="112" width="44" height="78" fill="#0a313b" />
      <rect x="14" y="92" width="96" height="98" fill="#072a32" />
      {windows(24, 104, 7, 6)}
      <rect x="452" y="70" width="96" height="120" fill="#072a32" />
      {windows(462, 84, 7, 7)}
      <rect x="58" y="78" width="22" height="14" rx="3" fill="#58b2c2" />
      <rect x="484" y="56" width="22" height="14" rx="3" fill="#58b2c2" />
      <path d="M80 82 C 200 81, 360 70, 484 52 L484 76 C 360 82, 200 86, 80 88 Z" fill="url(#beam-fill)" />
      <path d="M80 85 C 200 84, 360 76, 484 64" fill="none" stroke="#f2b84b" strokeWidth="1.5" strokeDasharray="5 6" />
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
