import { Button, Spinner, Stack, Text } from '@chakra-ui/react';
import { ErrorAlert } from '@/components/ui/error-alert';
import { Page } from '@/components/ui/page';
import { useSignedInUser } from '@/lib/signed-in-user';
import { useUpdateUser } from '../api/update-user';
import { useUsers } from '../api/get-users';
import { AddUserForm } from '../components/add-user-form';
import { UsersTable } from '../components/users-table';

export function UsersRoute() {
  const me = useSignedInUser();
  const users = useUsers();
  const updateUser = useUpdateUser();

  return (
    <Page title="Users" lead="Who can sign in to this kitchen, and what each person may do.">
      {updateUser.isError ? <ErrorAlert title="That change was not saved">{updateUser.error.message}</ErrorAlert> : null}
      {users.isPending ? (
        <Stack role="status" direction="row" align="center" gap="3">
          <Spinner color="accent.solid" />
          <Text>Loading users…</Text>
        </Stack>
      ) : users.isError ? (
        <Stack gap="3">
          <ErrorAlert title="The list of users could not be loaded">{users.error.message}</ErrorAlert>
          <Button alignSelf="flex-start" size="lg" variant="outline" onClick={() => void users.refetch()}>
            Try again
          </Button>
        </Stack>
      ) : (
        <UsersTable
          users={users.data}
          currentUserId={me.id}
          onUpdate={updateUser.mutate}
          pendingUserId={updateUser.isPending ? updateUser.variables.id : null}
        />
      )}
      <AddUserForm />
    </Page>
  );
}
