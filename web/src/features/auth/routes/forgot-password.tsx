import { Button, Link, Stack, Text } from '@chakra-ui/react';
import { passwordResetRequestSchema, type PasswordResetRequest } from '@crumbproof/shared';
import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect, useState } from 'react';
import { useForm } from 'react-hook-form';
import { Link as RouterLink } from 'react-router-dom';
import { ErrorAlert } from '@/components/ui/error-alert';
import { FormField, TextInput } from '@/components/ui/form-field';
import { placeFieldErrors } from '@/lib/place-field-errors';
import { useRequestPasswordReset } from '../api/account-links';
import { AuthCard } from '../components/auth-card';

/** "Forgot your password?": asks for a one-time link by mail. */
export function ForgotPasswordRoute() {
  const request = useRequestPasswordReset();
  const [answer, setAnswer] = useState<string | null>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<PasswordResetRequest>({ resolver: zodResolver(passwordResetRequestSchema), defaultValues: { email: '' } });

  useEffect(() => {
    document.title = 'Forgot your password · Crumbproof';
  }, []);

  function handleAsk(values: PasswordResetRequest) {
    setFormError(null);
    request.mutate(values, {
      onSuccess: (a) => setAnswer(a.message),
      onError: (error) => setFormError(placeFieldErrors(error, ['email'], setError, 'The link was not sent. Try again in a moment.')),
    });
  }

  return (
    <AuthCard
      title="Forgot your password?"
      lead="Give the email address you sign in with: a link to choose a new password is mailed to it."
    >
      {answer ? (
        <Stack gap="4" role="status">
          <Text>{answer}</Text>
          <Link asChild fontWeight="bold">
            <RouterLink to="/sign-in">Back to sign in</RouterLink>
          </Link>
        </Stack>
      ) : (
        <form noValidate onSubmit={handleSubmit(handleAsk)}>
          <Stack gap="5">
            {formError ? <ErrorAlert>{formError}</ErrorAlert> : null}
            <FormField label="Email" error={errors.email?.message}>
              <TextInput type="email" autoComplete="username" inputMode="email" {...register('email')} />
            </FormField>
            <Button type="submit" size="lg" loading={request.isPending} loadingText="Sending…">
              Send me a link
            </Button>
            <Link asChild>
              <RouterLink to="/sign-in">Back to sign in</RouterLink>
            </Link>
          </Stack>
        </form>
      )}
    </AuthCard>
  );
}
