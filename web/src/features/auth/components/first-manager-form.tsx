import { Button, Stack } from '@chakra-ui/react';
import { firstManagerSchema, PASSWORD_RULE, type FirstManagerRequest, type Me } from '@crumbproof/shared';
import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { ErrorAlert } from '@/components/ui/error-alert';
import { FormField, TextInput } from '@/components/ui/form-field';
import { placeFieldErrors } from '@/lib/place-field-errors';
import { useSetFirstManager } from '../api/set-first-manager';

const FIELDS = ['name', 'email', 'password'] as const;

interface FirstManagerFormProps {
  token: string;
  onSet: (me: Me) => void;
}

export function FirstManagerForm({ token, onSet }: FirstManagerFormProps) {
  const setFirstManager = useSetFirstManager();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<FirstManagerRequest>({
    resolver: zodResolver(firstManagerSchema),
    defaultValues: { token, name: '', email: '', password: '' },
  });

  function handleSet(values: FirstManagerRequest) {
    setFormError(null);
    setFirstManager.mutate(
      { ...values, token },
      {
        onSuccess: onSet,
        onError: (error) => setFormError(placeFieldErrors(error, FIELDS, setError, 'The manager was not set. Try again in a moment.')),
      },
    );
  }

  return (
    <form noValidate onSubmit={handleSubmit(handleSet)}>
      <Stack gap="5">
        {formError ? <ErrorAlert>{formError}</ErrorAlert> : null}
        <FormField label="Your name" error={errors.name?.message}>
          <TextInput autoComplete="name" {...register('name')} />
        </FormField>
        <FormField label="Email" error={errors.email?.message}>
          <TextInput type="email" autoComplete="username" inputMode="email" {...register('email')} />
        </FormField>
        <FormField label="Password" hint={PASSWORD_RULE} error={errors.password?.message}>
          <TextInput type="password" autoComplete="new-password" {...register('password')} />
        </FormField>
        <Button type="submit" size="lg" loading={setFirstManager.isPending} loadingText="Setting…">
          Set the first manager
        </Button>
      </Stack>
    </form>
  );
}
