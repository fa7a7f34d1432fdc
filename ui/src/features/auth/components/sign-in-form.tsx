import { useState, type FormEvent } from 'react';
import {
  Button,
  Field,
  Input,
  MessageBar,
  MessageBarBody,
  Spinner,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import { tooManySignInAttemptsMessage } from '@beamwright/link-core/contracts';
import { isApiError } from '@/lib/api-client';
import { useSignIn } from '@/lib/auth';

const useStyles = makeStyles({
  form: { display: 'grid', rowGap: tokens.spacingVerticalL },
  submit: { justifySelf: 'stretch', marginTop: tokens.spacingVerticalS },
});

interface FieldErrors {
  email?: string;
  password?: string;
}

// A plain shape check: the api decides whether the account exists.
const EMAIL_PATTERN = /^[^\s@]+@[^\s@]+\.[^\s@]+$/;

function validate(email: string, password: string): FieldErrors {
  const errors: FieldErrors = {};
  if (email.trim() === '') errors.email = 'Enter your email address.';
  else if (!EMAIL_PATTERN.test(email.trim())) errors.email = 'Enter an email address such as name@company.com.';
  if (password === '') errors.password = 'Enter your password.';
  return errors;
}

export function SignInForm({ onSignedIn }: { onSignedIn: () => void }) {
  const styles = useStyles();
  const signIn = useSignIn();
  const [email, setEmail] = useState('');
  const [password, setPassword] = useState('');
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);

  const onSubmit = (event: FormEvent) => {
    event.preventDefault();
    const errors = validate(email, password);
    setFieldErrors(errors);
    setFormError(null);
    if (errors.email || errors.password) return;
    signIn.mutate(
      { email: email.trim(), password },
      {
        onSuccess: onSignedIn,
        onError: (error) => {
          if (isApiError(error, 401)) {
            // Same words for an unknown account and a wrong password: ids must not leak.
            setFieldErrors({ password: 'The email address or password is not correct.' });
            return;
          }
          if (isApiError(error, 400) && error.issues.length > 0) {
            const next: FieldErrors = {};
            for (const issue of error.issues) {
              if (issue.path === 'email' || issue.path === 'password') next[issue.path] = issue.message;
            }
            setFieldErrors(next);
            if (!next.email && !next.password) setFormError(error.message);
            return;
          }
          if (isApiError(error, 429)) {
            // the wait comes from Retry-After (or the body's retryAfterS); the api's own words otherwise
            const retryAfterS = error.retryAfterS ?? (typeof error.body?.retryAfterS === 'number' ? error.body.retryAfterS : null);
            setFormError(retryAfterS !== null ? tooManySignInAttemptsMessage(retryAfterS) : error.message);
            return;
          }
          setFormError(error instanceof Error ? error.message : 'Signing in failed. Try again.');
        },
      },
    );
  };

  return (
    <form className={styles.form} onSubmit={onSubmit} noValidate aria-label="Sign in">
      {formError && (
        <MessageBar intent="error" role="alert">
          <MessageBarBody>{formError}</MessageBarBody>
        </MessageBar>
      )}
      <Field label="Email address" required validationMessage={fieldErrors.email} validationState={fieldErrors.email ? 'error' : 'none'}>
        <Input
          type="email"
          name="email"
          autoComplete="username"
          value={email}
          onChange={(_, data) => setEmail(data.value)}
          size="large"
        />
      </Field>
      <Field label="Password" required validationMessage={fieldErrors.password} validationState={fieldErrors.password ? 'error' : 'none'}>
        <Input
          type="password"
          name="password"
          autoComplete="current-password"
          value={password}
          onChange={(_, data) => setPassword(data.value)}
          size="large"
        />
      </Field>
      <Button
        type="submit"
        appearance="primary"
        size="large"
        className={styles.submit}
        disabled={signIn.isPending}
        icon={signIn.isPending ? <Spinner size="tiny" /> : undefined}
      >
        {signIn.isPending ? 'Signing in…' : 'Sign in'}
      </Button>
    </form>
  );
}
