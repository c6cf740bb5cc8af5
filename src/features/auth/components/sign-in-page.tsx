import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Navigate, useNavigate, useSearchParams } from 'react-router';
import { SignInBody } from '@shared/schemas/auth';
import { ApiError } from '@/lib/api-client';
import { safeNext } from '@/lib/safe-next';
import { useMe } from '@/api/me/get-me';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormError } from '@/components/ui/form-error';
import { LoadingBlock } from '@/components/ui/spinner';
import { TextField } from '@/components/ui/text-field';
import { useSignIn } from '@/api/auth/sign-in';

export function SignInPage() {
  const [params] = useSearchParams();
  const next = safeNext(params.get('next'));
  const navigate = useNavigate();
  const me = useMe();
  const signIn = useSignIn();
  const form = useForm({ resolver: zodResolver(SignInBody), defaultValues: { email: '', password: '' } });
  const { errors } = form.formState;

  if (me.isPending) return <LoadingBlock />;
  if (me.data) return <Navigate to={next} replace />;

  const onSubmit = form.handleSubmit((body) =>
    signIn.mutate(body, {
      onSuccess: () => navigate(next, { replace: true }),
      onError: () => form.resetField('password', { keepError: false }),
    }),
  );

  return (
    <div className="mx-auto w-full max-w-sm">
      <h1 className="mb-1 text-title">Sign in</h1>
      <p className="mb-5 text-body text-ink-soft">Use the e-mail address your team invited.</p>
      <Card>
        <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
          <TextField label="E-mail" type="email" autoComplete="username" autoFocus error={errors.email?.message} {...form.register('email')} />
          <TextField label="Password" type="password" autoComplete="current-password" error={errors.password?.message} {...form.register('password')} />
          <SignInProblem error={signIn.error} />
          <Button type="submit" variant="primary" busy={signIn.isPending}>
            Sign in
          </Button>
        </form>
      </Card>
      <p className="mt-4 text-micro text-ink-faint">
        No account yet? Ask an admin of your team to invite you; the invitation e-mail has a link to set your password.
      </p>
    </div>
  );
}

/** Wrong password and too many attempts get their own plain wording; anything else shows the server's words. */
function SignInProblem({ error }: { error: unknown }) {
  if (!error) return null;
  if (error instanceof ApiError && error.status === 401) {
    return <FormError error={new ApiError(401, error.title, 'That e-mail and password do not match an account. Check both and try again.')} />;
  }
  if (error instanceof ApiError && error.status === 429) {
    return <FormError error={new ApiError(429, error.title, error.detail || 'Too many sign-in attempts. Wait 15 minutes and try again.')} />;
  }
  return <FormError error={error} hideFields={['email', 'password']} />;
}
