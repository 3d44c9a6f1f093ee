import { Text } from '@chakra-ui/react';
import { useKitchenName } from '@/api/kitchen';
import { ErrorAlert } from '@/components/ui/error-alert';
import { LoadFailed } from '@/components/ui/load-failed';
import { Loading } from '@/components/ui/loading';
import { Page } from '@/components/ui/page';
import { useSignedInUser } from '@/lib/signed-in-user';
import { useState } from 'react';
import { useResendInvitation } from '../api/resend-invitation';
import { useTakeOffKitchen } from '../api/take-off-kitchen';
import { useUpdateUser } from '../api/update-user';
import { useUsers } from '../api/get-users';
import { AddUserForm } from '../components/add-user-form';
import { accessChanged, ConfirmAccessChange, type AccessChange } from '../components/confirm-access-change';
import { UsersTable } from '../components/users-table';

export function UsersRoute() {
  const me = useSignedInUser();
  const users = useUsers();
  const kitchen = useKitchenName();
  // Roles are per kitchen: the list, and every change made here, are for the kitchen the app works in.
  const roleLabel = kitchen ? `Role at ${kitchen}` : 'Role';
  const updateUser = useUpdateUser();
  const takeOff = useTakeOffKitchen();
  const resend = useResendInvitation();
  const [resent, setResent] = useState<string | null>(null);
  const [asking, setAsking] = useState<AccessChange | null>(null);
  const [done, setDone] = useState<string | null>(null);

  const confirm = (change: AccessChange) => {
    const settled = { onSettled: () => setAsking(null) };
    if (change.kind === 'take-off') {
      // The API's answer says where the person still works, if anywhere.
      takeOff.mutate(change.user.id, { ...settled, onSuccess: (answer) => setDone(answer.message) });
      return;
    }
    updateUser.mutate({ id: change.user.id, changes: change.changes }, { ...settled, onSuccess: () => setDone(accessChanged(change)) });
  };

  const pending = updateUser.isPending
    ? { userId: updateUser.variables.id, kind: 'update' as const }
    : takeOff.isPending
      ? { userId: takeOff.variables, kind: 'take-off' as const }
      : null;

  return (
    <Page
      title="Users"
      lead={`Who can sign in to ${kitchen ?? 'this kitchen'}, and what each person may do here. Invite someone by email: they choose their own password.`}
    >
      {updateUser.isError ? <ErrorAlert title="That change was not saved">{updateUser.error.message}</ErrorAlert> : null}
      {takeOff.isError ? <ErrorAlert title="Nobody was taken off this kitchen">{takeOff.error.message}</ErrorAlert> : null}
      {resend.isError ? <ErrorAlert title="The invitation was not sent again">{resend.error.message}</ErrorAlert> : null}
      <Text role="status">{done ?? resent}</Text>
      {users.isPending ? (
        <Loading>Loading users…</Loading>
      ) : users.isError ? (
        <LoadFailed title="The list of users could not be loaded" error={users.error} onRetry={() => void users.refetch()} />
      ) : (
        <UsersTable
          users={users.data}
          currentUserId={me.id}
          onRequest={(change) => {
            // A new request clears what the last one said.
            setDone(null);
            setResent(null);
            updateUser.reset();
            takeOff.reset();
            setAsking(change);
          }}
          pendingUserId={pending?.userId ?? null}
          pendingKind={pending?.kind ?? null}
          onResend={(user) => {
            setResent(null);
            setDone(null);
            resend.mutate(user.id, {
              onSuccess: () => setResent(`A new invitation is on its way to ${user.email}; the earlier link no longer works.`),
            });
          }}
          resendingUserId={resend.isPending ? resend.variables : null}
          roleHeader={kitchen ? 'Role here' : 'Role'}
        />
      )}
      <ConfirmAccessChange
        change={asking}
        kitchen={kitchen}
        pending={pending !== null}
        onConfirm={confirm}
        onCancel={() => setAsking(null)}
      />
      <AddUserForm roleLabel={roleLabel} />
    </Page>
  );
}
