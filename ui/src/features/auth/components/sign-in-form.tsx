import { Controller, useForm, type FieldError } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
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
import { LoginRequestSchema, TooManyRequestsBodySchema, tooManySignInAttemptsMessage, type LoginRequest } from '@beamwright/link-core/contracts';
import { isApiError } from '@/lib/api-client';
import { setApiFieldErrors, withFieldMessages } from '@/lib/form-errors';
import { useSignIn } from '@/lib/auth';

const useStyles = makeStyles({
  form: { display: 'grid', rowGap: tokens.spacingVerticalL },
  submit: { justifySelf: 'stretch', marginTop: tokens.spacingVerticalS },
});

type SignInField = keyof LoginRequest;

/** The sign-in request's own schema, in words that tell a person what to type. */
function describe(field: string, error: FieldError): string {
  if (field === 'password') return 'Enter your password.';
  return error.type === 'too_small' ? 'Enter your email address.' : 'Enter an email address such as name@company.com.';
}
const resolver = withFieldMessages(zodResolver(LoginRequestSchema), describe);

export function SignInForm({ onSignedIn }: { onSignedIn: () => void }) {
  const styles = useStyles();
  const signIn = useSignIn();
  const { control, formState, handleSubmit, setError } = useForm({
    defaultValues: { email: '', password: '' },
    resolver,
    shouldFocusError: false,
  });
  const formError = formState.errors.root?.message;

  const onSubmit = handleSubmit((request) => {
    signIn.mutate(request, {
      onSuccess: onSignedIn,
      onError: (error) => {
        if (isApiError(error, 401)) {
          // Same words for an unknown account and a wrong password: ids must not leak.
          setError('password', { type: 'server', message: 'The email address or password is not correct.' });
          return;
        }
        if (isApiError(error, 429)) {
          // the wait comes from Retry-After (or the body's retryAfterS); the api's own words otherwise
          const body = TooManyRequestsBodySchema.safeParse(error.body);
          const retryAfterS = error.retryAfterS ?? (body.success ? body.data.retryAfterS : null);
          setError('root', { message: retryAfterS !== null ? tooManySignInAttemptsMessage(retryAfterS) : error.message });
          return;
        }
        // the api's reasons are shown as they come, beside their field
        const mapped = setApiFieldErrors<SignInField>(error, setError, (path) => (path === 'email' || path === 'password' ? { field: path } : null));
        if (!mapped || mapped.fieldCount === 0) setError('root', { message: error instanceof Error ? error.message : 'Signing in failed. Try again.' });
      },
    });
  });

  return (
    <form className={styles.form} onSubmit={onSubmit} noValidate aria-label="Sign in">
      {formError && (
        <MessageBar intent="error" role="alert">
          <MessageBarBody>{formError}</MessageBarBody>
        </MessageBar>
      )}
      <Controller
        name="email"
        control={control}
        render={({ field, fieldState }) => (
          <Field label="Email address" required validationMessage={fieldState.error?.message} validationState={fieldState.error ? 'error' : 'none'}>
            <Input {...field} type="email" autoComplete="username" onChange={(_, data) => field.onChange(data.value)} size="large" />
          </Field>
        )}
      />
      <Controller
        name="password"
        control={control}
        render={({ field, fieldState }) => (
          <Field label="Password" required validationMessage={fieldState.error?.message} validationState={fieldState.error ? 'error' : 'none'}>
            <Input {...field} type="password" autoComplete="current-password" onChange={(_, data) => field.onChange(data.value)} size="large" />
          </Field>
        )}
      />
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
