import { Button, Dialog, HStack, Portal, Text } from '@chakra-ui/react';
import { ROLE_LABELS, type Role, type UpdateUserRequest, type User } from '@crumbproof/shared';

/** What each role may do, in the words the confirmation and the result say. */
export const ROLE_ABILITIES: Record<Role, string> = {
  manager:
    'approve changes, print labels, keep the kitchen’s settings, users and mail, and read the audit trail, besides all a pastry chef does',
  'pastry-chef': 'edit ingredients and recipes, run the swap check, print labels and answer the counter’s questions',
  'front-of-house': 'read declarations and answer customers at the counter, without editing anything',
};

/** "2 other kitchens": the other kitchens someone works at besides this one. */
export function otherKitchens(count: number): string {
  return `${count} other kitchen${count === 1 ? '' : 's'}`;
}

/**
 * A change of someone's access waiting for the manager to confirm it: a new role here or another
 * active state (`update`), or taking them off the kitchen the app works in (`take-off`).
 */
export type AccessChange =
  { kind: 'update'; user: User; changes: Pick<UpdateUserRequest, 'role' | 'active'> } | { kind: 'take-off'; user: User };

/** The question and the two buttons of a change, in words; `kitchen` is the name of the kitchen the app works in. */
export function askAccessChange(change: AccessChange, kitchen: string | undefined) {
  const { user } = change;
  const here = kitchen ?? 'this kitchen';
  const elsewhere = user.elsewhere ?? 0;
  if (change.kind === 'take-off') {
    return {
      title: `Take ${user.name} off ${here}?`,
      body:
        `${user.name} will no longer work at ${here}: their role here (${ROLE_LABELS[user.role]}) goes, and their sessions end now. ` +
        (elsewhere > 0
          ? `Their account stays, with its name and password, and so do the ${otherKitchens(elsewhere)} they work at.`
          : 'Their account stays, with its name and password, but they work at no other kitchen: a manager can add them again by their email.') +
        ' Their name stays on everything they recorded here.',
      confirm: 'Take off this kitchen',
      keep: 'Keep them here',
    };
  }
  const { changes } = change;
  if (changes.role !== undefined) {
    const role = ROLE_LABELS[changes.role];
    return {
      title: `Make ${user.name} ${role}?`,
      body:
        `As ${role}, ${user.name} will be able to ${ROLE_ABILITIES[changes.role]}. Their sessions end now: at their next step they sign in again and see the menu of the new role.` +
        (elsewhere > 0 ? ` Their role at the ${otherKitchens(elsewhere)} they work at stays as it is.` : ''),
      confirm: `Make ${role}`,
      keep: `Keep ${ROLE_LABELS[user.role]}`,
    };
  }
  if (changes.active === false) {
    return {
      title: `Deactivate ${user.name}?`,
      body:
        (elsewhere > 0
          ? `${user.name} can no longer sign in, here or at the ${otherKitchens(elsewhere)} they work at, and their sessions end now: their account is the same at each. Only a manager at every one of them can do this; to stop them working here only, take them off this kitchen instead.`
          : `${user.name} can no longer sign in, and their sessions end now.`) +
        ' Their name stays on everything they recorded. You can reactivate them later.',
      confirm: `Deactivate ${user.name}`,
      keep: 'Keep them active',
    };
  }
  return {
    title: `Reactivate ${user.name}?`,
    body: `${user.name} can sign in again as ${ROLE_LABELS[user.role]}.`,
    confirm: `Reactivate ${user.name}`,
    keep: 'Leave them deactivated',
  };
}

/** What a confirmed change of role or active state did, in words. */
export function accessChanged({ user, changes }: Extract<AccessChange, { kind: 'update' }>): string {
  if (changes.role !== undefined) return `${user.name} is now ${ROLE_LABELS[changes.role]}: they can ${ROLE_ABILITIES[changes.role]}.`;
  if (changes.active === false) return `${user.name} is deactivated and can no longer sign in.`;
  return `${user.name} can sign in again as ${ROLE_LABELS[user.role]}.`;
}

interface ConfirmAccessChangeProps {
  change: AccessChange | null;
  /** The name of the kitchen the app works in, which a role and taking someone off are for. */
  kitchen: string | undefined;
  pending: boolean;
  onConfirm: (change: AccessChange) => void;
  onCancel: () => void;
}

/** Asks the manager to confirm a change of role or access, or taking someone off the kitchen, before it is sent. */
export function ConfirmAccessChange({ change, kitchen, pending, onConfirm, onCancel }: ConfirmAccessChangeProps) {
  const words = change ? askAccessChange(change, kitchen) : null;
  return (
    <Dialog.Root open={change !== null} onOpenChange={(e) => (e.open ? undefined : onCancel())} role="alertdialog" size="md">
      <Portal>
        <Dialog.Backdrop />
        <Dialog.Positioner>
          <Dialog.Content bg="bg.panel" color="fg">
            {change && words ? (
              <>
                <Dialog.Header>
                  <Dialog.Title fontSize="xl">{words.title}</Dialog.Title>
                </Dialog.Header>
                <Dialog.Body>
                  <Text>{words.body}</Text>
                </Dialog.Body>
                <Dialog.Footer>
                  <HStack gap="3" wrap="wrap">
                    <Button size="lg" variant="outline" onClick={onCancel}>
                      {words.keep}
                    </Button>
                    <Button size="lg" colorPalette="accent" loading={pending} onClick={() => onConfirm(change)}>
                      {words.confirm}
                    </Button>
                  </HStack>
                </Dialog.Footer>
              </>
            ) : null}
          </Dialog.Content>
        </Dialog.Positioner>
      </Portal>
    </Dialog.Root>
  );
}
