import { Badge, Button, Stack, Text } from '@chakra-ui/react';
import { ROLE_LABELS, ROLES, type Role, type User } from '@crumbproof/shared';
import { useMemo } from 'react';
import { DataTable, dataTableColumns, type DataTableColumn } from '@/components/ui/data-table';
import { SelectInput } from '@/components/ui/form-field';
import { Quantity } from '@/components/ui/quantity';
import { otherKitchens, type AccessChange } from './confirm-access-change';

const ROLE_OPTIONS = ROLES.map((role) => ({ value: role, label: ROLE_LABELS[role] }));

const dateFormat = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric' });

function formatDate(iso: string): string {
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? iso : dateFormat.format(date);
}

const column = dataTableColumns<User>();

interface UsersTableProps {
  users: User[];
  /** The signed-in manager: their own row cannot be demoted or deactivated from here. */
  currentUserId: number;
  /** Asks for a change of role or access, or to take someone off the kitchen (confirmed before it is sent). */
  onRequest: (change: AccessChange) => void;
  /** The person whose change is being sent, if any (their row waits for it), and what kind of change it is. */
  pendingUserId: number | null;
  pendingKind: AccessChange['kind'] | null;
  /** Sends a new invitation to someone who has not chosen a password yet. */
  onResend: (user: User) => void;
  resendingUserId: number | null;
  /** "Role here": roles are per kitchen, and the list (its lead names the kitchen) answers for the one the app works in; short, so the row keeps its Access column in view on a tablet. */
  roleHeader: string;
}

export function UsersTable({
  users,
  currentUserId,
  onRequest,
  pendingUserId,
  pendingKind,
  onResend,
  resendingUserId,
  roleHeader,
}: UsersTableProps) {
  const columns = useMemo<DataTableColumn<User>[]>(
    () => [
      column.accessor('name', {
        header: 'Name',
        meta: { sticky: true, maxW: '16rem' },
        cell: (info) => (
          <Stack gap="1">
            <Text as="span" fontWeight="bold">
              {info.getValue()}
              {info.row.original.id === currentUserId ? (
                <Text as="span" fontWeight="normal" color="fg.muted">
                  {' '}
                  (you)
                </Text>
              ) : null}
            </Text>
            {/* Their password and active state are the account's at each of those kitchens too. */}
            {(info.row.original.elsewhere ?? 0) > 0 ? (
              <Text as="span" color="fg.muted">
                <Quantity>{`Also works at ${otherKitchens(info.row.original.elsewhere ?? 0)}`}</Quantity>
              </Text>
            ) : null}
            {/* Below 1024 px the email and the date of creation fold in under the name, leaving room for the access. */}
            <Text as="span" hideFrom="lg">
              {info.row.original.email}
            </Text>
            <Text as="span" hideFrom="lg" color="fg.muted">
              <Quantity>{`Created ${formatDate(info.row.original.createdAt)}`}</Quantity>
            </Text>
          </Stack>
        ),
      }),
      column.accessor('email', { header: 'Email', meta: { hideBelow: 'lg', maxW: '16rem' } }),
      column.accessor('role', {
        header: roleHeader,
        cell: (info) => {
          const user = info.row.original;
          return (
            <SelectInput
              aria-label={`Role for ${user.name}`}
              minW="44"
              options={ROLE_OPTIONS}
              value={user.role}
              disabled={user.id === currentUserId || pendingUserId === user.id}
              onChange={(event) => onRequest({ kind: 'update', user, changes: { role: event.currentTarget.value as Role } })}
            />
          );
        },
      }),
      column.accessor('active', {
        header: 'Active',
        meta: { maxW: '12rem' },
        cell: (info) =>
          info.getValue() && info.row.original.invitationPending ? (
            <Stack align="flex-start" gap="2">
              <Badge variant="outline" size="lg" borderStyle="dashed" whiteSpace="normal" h="auto" py="1">
                Invited, no password yet
              </Badge>
              <Button
                size="lg"
                variant="outline"
                aria-label={`Send the invitation again to ${info.row.original.name}`}
                loading={resendingUserId === info.row.original.id}
                onClick={() => onResend(info.row.original)}
              >
                Invite again
              </Button>
            </Stack>
          ) : info.getValue() ? (
            <Badge variant="subtle" colorPalette="accent" size="lg">
              Active
            </Badge>
          ) : (
            <Badge variant="outline" color="fg.muted" size="lg">
              Deactivated
            </Badge>
          ),
      }),
      column.accessor('createdAt', {
        header: 'Created',
        meta: { hideBelow: 'lg' },
        cell: (info) => <Quantity>{formatDate(info.row.original.createdAt)}</Quantity>,
      }),
      column.display({
        id: 'actions',
        header: 'Access',
        cell: (info) => {
          const user = info.row.original;
          if (user.id === currentUserId) return <Text color="fg.muted">Your own account</Text>;
          const action = user.active ? 'Deactivate' : 'Reactivate';
          const waiting = pendingUserId === user.id ? pendingKind : null;
          return (
            // One above the other, so the column is one button wide and stays in view on a tablet.
            <Stack gap="2" align="flex-start">
              <Button
                size="lg"
                variant="outline"
                aria-label={`${action} ${user.name}`}
                disabled={waiting !== null}
                loading={waiting === 'update'}
                onClick={() => onRequest({ kind: 'update', user, changes: { active: !user.active } })}
              >
                {action}
              </Button>
              <Button
                size="lg"
                variant="outline"
                aria-label={`Take ${user.name} off this kitchen`}
                disabled={waiting !== null}
                loading={waiting === 'take-off'}
                onClick={() => onRequest({ kind: 'take-off', user })}
              >
                Take off
              </Button>
            </Stack>
          );
        },
      }),
    ],
    [currentUserId, onRequest, pendingUserId, pendingKind, onResend, resendingUserId, roleHeader],
  );

  return (
    <DataTable
      caption="People who can sign in to this kitchen"
      columns={columns}
      data={users}
      getRowId={(user) => String(user.id)}
      empty="No users yet. Add the first one below."
    />
  );
}
