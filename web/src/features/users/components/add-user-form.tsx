import { Box, Button, Heading, SimpleGrid, Stack, Text } from '@chakra-ui/react';
import { inviteUserSchema, ROLE_LABELS, ROLES, type InviteUserRequest } from '@crumbproof/shared';
import { zodResolver } from '@hookform/resolvers/zod';
import { useId, useState } from 'react';
import { useForm } from 'react-hook-form';
import { ErrorAlert } from '@/components/ui/error-alert';
import { FormField, SelectInput, TextInput } from '@/components/ui/form-field';
import { isApiError } from '@/lib/api-client';
import { placeFieldErrors } from '@/lib/place-field-errors';
import { useInviteUser } from '../api/invite-user';

const FIELDS = ['name', 'email', 'role'] as const satisfies readonly (keyof InviteUserRequest)[];

const ROLE_OPTIONS = ROLES.map((role) => ({ value: role, label: ROLE_LABELS[role] }));

interface AddUserFormProps {
  /** "Role at Saltmarsh Yard Café": the invited person gets their role at the kitchen the app works in. */
  roleLabel: string;
}

/**
 * Invites someone by name, email and role: they choose their own password from the mailed link.
 * Someone whose email already has an account at another kitchen is given the role here instead.
 */
export function AddUserForm({ roleLabel }: AddUserFormProps) {
  const inviteUser = useInviteUser();
  const headingId = useId();
  const [formError, setFormError] = useState<string | null>(null);
  const [added, setAdded] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors },
  } = useForm<InviteUserRequest>({
    resolver: zodResolver(inviteUserSchema),
    defaultValues: { name: '', email: '', role: 'front-of-house' },
  });

  function handleAdd(values: InviteUserRequest) {
    setFormError(null);
    setAdded(null);
    inviteUser.mutate(values, {
      onSuccess: (user) => {
        reset();
        // The API says which it did: an account of another kitchen keeps its own password and gets no mail.
        setAdded(
          user.outcome === 'added'
            ? user.message
            : `${user.message} The link works for 72 hours; once they have chosen a password they sign in as ${ROLE_LABELS[user.role]}.`,
        );
      },
      onError: (error) => {
        // A taken email is the email's problem, whatever the API names.
        if (isApiError(error) && error.code === 'conflict') {
          setError('email', { message: error.message });
          return;
        }
        setFormError(placeFieldErrors(error, FIELDS, setError, 'The invitation was not sent. Try again in a moment.'));
      },
    });
  }

  return (
    <Box as="section" bg="bg.panel" borderWidth="1px" borderColor="border.muted" rounded="md" p={{ base: '4', md: '6' }}>
      <form aria-labelledby={headingId} noValidate onSubmit={handleSubmit(handleAdd)}>
        <Stack gap="5">
          <Heading as="h2" size="lg" id={headingId}>
            Invite a user
          </Heading>
          <Text color="fg.muted">
            They get a mail with a link to choose their password. Someone who already works at another kitchen keeps their own account: they
            are added here in the role you choose, and no mail is sent.
          </Text>
          {formError ? <ErrorAlert>{formError}</ErrorAlert> : null}
          <SimpleGrid columns={{ base: 1, md: 2 }} gap="5">
            <FormField label="Name" error={errors.name?.message}>
              <TextInput autoComplete="off" {...register('name')} />
            </FormField>
            <FormField label="Email" error={errors.email?.message}>
              <TextInput type="email" autoComplete="off" inputMode="email" {...register('email')} />
            </FormField>
            <FormField label={roleLabel} error={errors.role?.message}>
              <SelectInput options={ROLE_OPTIONS} {...register('role')} />
            </FormField>
          </SimpleGrid>
          <Stack direction={{ base: 'column', md: 'row' }} gap="4" align={{ md: 'center' }}>
            <Button type="submit" size="lg" alignSelf="flex-start" loading={inviteUser.isPending} loadingText="Sending…">
              Send invitation
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
