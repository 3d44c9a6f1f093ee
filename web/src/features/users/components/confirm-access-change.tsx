import { Button, Dialog, HStack, Portal, Text } from '@chakra-ui/react';
import { ROLE_LABELS, type Role, type UpdateUserRequest, type User } from '@crumbproof/shared';

/** What each role may do, in the words the confirmation and the result say. */
export const ROLE_ABILITIES: Record<Role, string> = {
  manager:
    'approve changes, print labels, keep the kitchen’s settings, users and mail, and read the audit trail, besides all a pastry chef does',
  'pastry-chef': 'edit ingredients and recipes, run the swap check, print labels and answer the counter’s questions',
  'front-of-house': 'read declarations and answer customers at the counter, without editing anything',
};

/** A change of someone's access waiting for the manager to confirm it. */
export interface AccessChange {
  user: User;
  changes: Pick<UpdateUserRequest, 'role' | 'active'>;
}

/** The question, the confirm button and the result of a change, in words. */
export function describeAccessChange({ user, changes }: AccessChange) {
  if (changes.role !== undefined) {
    const role = ROLE_LABELS[changes.role];
    return {
      title: `Make ${user.name} ${role}?`,
      body: `As ${role}, ${user.name} will be able to ${ROLE_ABILITIES[changes.role]}. Their sessions end now: at their next step they sign in again and see the menu of the new role.`,
      confirm: `Make ${role}`,
      keep: `Keep ${ROLE_LABELS[user.role]}`,
      done: `${user.name} is now ${role}: they can ${ROLE_ABILITIES[changes.role]}.`,
    };
  }
  if (changes.active === false) {
    return {
      title: `Deactivate ${user.name}?`,
      body: `${user.name} can no longer sign in, and their sessions end now. Their name stays on everything they recorded. You can reactivate them later.`,
      confirm: `Deactivate ${user.name}`,
      keep: 'Keep them active',
      done: `${user.name} is deactivated and can no longer sign in.`,
    };
  }
  return {
    title: `Reactivate ${user.name}?`,
    body: `${user.name} can sign in again as ${ROLE_LABELS[user.role]}.`,
    confirm: `Reactivate ${user.name}`,
    keep: 'Leave them deactivated',
    done: `${user.name} can sign in again as ${ROLE_LABELS[user.role]}.`,
  };
}

interface ConfirmAccessChangeProps {
  change: AccessChange | null;
  pending: boolean;
  onConfirm: (change: AccessChange) => void;
  onCancel: () => void;
}

/** Asks the manager to confirm a change of role or access before it is sent. */
export function ConfirmAccessChange({ change, pending, onConfirm, onCancel }: ConfirmAccessChangeProps) {
  const words = change ? describeAccessChange(change) : null;
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
