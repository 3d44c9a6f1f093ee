import { Button, Stack } from '@chakra-ui/react';
import { PASSWORD_RULE, setPasswordSchema, type SetPasswordRequest } from '@crumbproof/shared';
import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { ErrorAlert } from '@/components/ui/error-alert';
import { FormField, TextInput } from '@/components/ui/form-field';
import { placeFieldErrors } from '@/lib/place-field-errors';
import { useSetPassword } from '../api/account-links';

const FIELDS = ['password'] as const;

interface SetPasswordFormProps {
  token: string;
  email: string;
  submitLabel: string;
  onSet: (email: string) => void;
}

export function SetPasswordForm({ token, email, submitLabel, onSet }: SetPasswordFormProps) {
  const setPassword = useSetPassword();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<SetPasswordRequest>({ resolver: zodResolver(setPasswordSchema), defaultValues: { token, password: '' } });

  function handleSet(values: SetPasswordRequest) {
    setFormError(null);
    setPassword.mutate(
      { token, password: values.password },
      {
        onSuccess: (done) => onSet(done.email),
        onError: (error) => setFormError(placeFieldErrors(error, FIELDS, setError, 'The password was not set. Try again in a moment.')),
      },
    );
  }

  return (
    <form noValidate onSubmit={handleSubmit(handleSet)}>
      <Stack gap="5">
        {formError ? <ErrorAlert>{formError}</ErrorAlert> : null}
        {/* The account's address, for the browser's password manager. */}
        <input type="email" name="username" autoComplete="username" value={email} readOnly hidden />
        <FormField label="New password" hint={PASSWORD_RULE} error={errors.password?.message}>
          <TextInput type="password" autoComplete="new-password" {...register('password')} />
        </FormField>
        <Button type="submit" size="lg" loading={setPassword.isPending} loadingText="Saving…">
          {submitLabel}
        </Button>
      </Stack>
    </form>
  );
}
