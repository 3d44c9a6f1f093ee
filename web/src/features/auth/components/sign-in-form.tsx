import { Button, Stack } from '@chakra-ui/react';
import { signInSchema, type Me, type SignInRequest } from '@crumbproof/shared';
import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { ErrorAlert } from '@/components/ui/error-alert';
import { FormField, TextInput } from '@/components/ui/form-field';
import { placeFieldErrors } from '@/lib/place-field-errors';
import { useSignIn } from '../api/sign-in';

interface SignInFormProps {
  onSignedIn: (me: Me) => void;
}

export function SignInForm({ onSignedIn }: SignInFormProps) {
  const signIn = useSignIn();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<SignInRequest>({
    resolver: zodResolver(signInSchema),
    defaultValues: { email: '', password: '' },
  });

  function handleSignIn(values: SignInRequest) {
    setFormError(null);
    signIn.mutate(values, {
      onSuccess: onSignedIn,
      onError: (error) =>
        setFormError(placeFieldErrors(error, ['email', 'password'], setError, 'Signing in did not work. Try again in a moment.')),
    });
  }

  return (
    <form noValidate onSubmit={handleSubmit(handleSignIn)}>
      <Stack gap="5">
        {formError ? <ErrorAlert>{formError}</ErrorAlert> : null}
        <FormField label="Email" error={errors.email?.message}>
          <TextInput type="email" autoComplete="username" inputMode="email" {...register('email')} />
        </FormField>
        <FormField label="Password" error={errors.password?.message}>
          <TextInput type="password" autoComplete="current-password" {...register('password')} />
        </FormField>
        <Button type="submit" size="lg" loading={signIn.isPending} loadingText="Signing in…">
          Sign in
        </Button>
      </Stack>
    </form>
  );
}
