import { Box, Button, Heading, SimpleGrid, Stack, Text } from '@chakra-ui/react';
import { createUserSchema, PASSWORD_RULE, ROLE_LABELS, ROLES, type CreateUserRequest } from '@crumbproof/shared';
import { zodResolver } from '@hookform/resolvers/zod';
import { useId, useState } from 'react';
import { useForm } from 'react-hook-form';
import { ErrorAlert } from '@/components/ui/error-alert';
import { FormField, SelectInput, TextInput } from '@/components/ui/form-field';
import { isApiError } from '@/lib/api-client';
import { placeFieldErrors } from '@/lib/place-field-errors';
import { useCreateUser } from '../api/create-user';

const FIELDS = ['name', 'email', 'role', 'password'] as const satisfies readonly (keyof CreateUserRequest)[];

const ROLE_OPTIONS = ROLES.map((role) => ({ value: role, label: ROLE_LABELS[role] }));

export const PASSWORD_HINT = PASSWORD_RULE;

export function AddUserForm() {
  const createUser = useCreateUser();
  const headingId = useId();
  const [formError, setFormError] = useState<string | null>(null);
  const [added, setAdded] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors },
  } = useForm<CreateUserRequest>({
    resolver: zodResolver(createUserSchema),
    defaultValues: { name: '', email: '', role: 'front-of-house', password: '' },
  });

  function handleAdd(values: CreateUserRequest) {
    setFormError(null);
    setAdded(null);
    createUser.mutate(values, {
      onSuccess: (user) => {
        reset();
        setAdded(`${user.name} can now sign in as ${ROLE_LABELS[user.role]}.`);
      },
      onError: (error) => {
        // A taken email is the email's problem, whatever the API names.
        if (isApiError(error) && error.code === 'conflict') {
          setError('email', { message: error.message });
          return;
        }
        setFormError(placeFieldErrors(error, FIELDS, setError, 'The user was not added. Try again in a moment.'));
      },
    });
  }

  return (
    <Box as="section" bg="bg.panel" borderWidth="1px" borderColor="border.muted" rounded="md" p={{ base: '4', md: '6' }}>
      <form aria-labelledby={headingId} noValidate onSubmit={handleSubmit(handleAdd)}>
        <Stack gap="5">
          <Heading as="h2" size="lg" id={headingId}>
            Add a user
          </Heading>
          {formError ? <ErrorAlert>{formError}</ErrorAlert> : null}
          <SimpleGrid columns={{ base: 1, md: 2 }} gap="5">
            <FormField label="Name" error={errors.name?.message}>
              <TextInput autoComplete="off" {...register('name')} />
            </FormField>
            <FormField label="Email" error={errors.email?.message}>
              <TextInput type="email" autoComplete="off" inputMode="email" {...register('email')} />
            </FormField>
            <FormField label="Role" error={errors.role?.message}>
              <SelectInput options={ROLE_OPTIONS} {...register('role')} />
            </FormField>
            <FormField label="Password" hint={PASSWORD_HINT} error={errors.password?.message}>
              <TextInput type="password" autoComplete="new-password" {...register('password')} />
            </FormField>
          </SimpleGrid>
          <Stack direction={{ base: 'column', md: 'row' }} gap="4" align={{ md: 'center' }}>
            <Button type="submit" size="lg" alignSelf="flex-start" loading={createUser.isPending} loadingText="Adding…">
              Add user
            </Button>
            <Text role="status" color="fg.muted">
              {added}
            </Text>
          </Stack>
        </Stack>
      </form>
    </Box>
  );
}
