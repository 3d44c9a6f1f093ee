import { Field, NativeSelect, Text } from '@chakra-ui/react';
import { ROLE_LABELS } from '@crumbproof/shared';
import { useLocation, useNavigate } from 'react-router-dom';
import { useKitchenName } from '@/api/kitchen';
import { useSignedInUser } from '@/lib/signed-in-user';
import { confirmLeavingUnsaved } from '@/lib/unsaved-changes';
import { useWorkIn } from '@/lib/use-work-in';
import { canOpen, firstPathFor, pageAt } from '../navigation';

/**
 * Which kitchen the app answers for, under the product's name: its name, and for someone of
 * several kitchens the choice of another. Moving to another kitchen keeps the page when the
 * person's role there may open it, and opens their first page there otherwise.
 */
export function KitchenSwitcher() {
  const me = useSignedInUser();
  const name = useKitchenName();
  const workIn = useWorkIn();
  const navigate = useNavigate();
  const { pathname } = useLocation();

  // One kitchen, or none set up yet (then its name comes from its settings; if they cannot be read the header goes without).
  if (me.kitchens.length < 2 || me.kitchen === null) {
    return name ? (
      <Text color="fg.muted" fontSize="sm">
        {'Working in '}
        <Text as="span" color="fg" fontWeight="bold">
          {name}
        </Text>
      </Text>
    ) : null;
  }

  function handleChange(id: number) {
    const kitchen = me.kitchens.find((k) => k.id === id);
    if (!kitchen || kitchen.id === me.kitchen) return;
    // Every page is read again for the other kitchen: an editor's unsaved changes would be lost.
    if (!confirmLeavingUnsaved()) return;
    const page = pageAt(pathname);
    const stays = page !== null && canOpen(kitchen.role, page);
    workIn(me, kitchen.id);
    if (!stays) void navigate(firstPathFor(kitchen.role), { replace: true });
  }

  return (
    <Field.Root gap="0">
      <Field.Label color="fg.muted" fontSize="sm" fontWeight="normal">
        Working in
      </Field.Label>
      <NativeSelect.Root size="sm" w="auto" minW="56">
        <NativeSelect.Field
          bg="bg.panel"
          borderColor="border"
          fontWeight="bold"
          value={String(me.kitchen)}
          onChange={(event) => handleChange(Number(event.currentTarget.value))}
        >
          {me.kitchens.map((kitchen) => (
            <option key={kitchen.id} value={kitchen.id}>
              {`${kitchen.name} (${ROLE_LABELS[kitchen.role]})`}
            </option>
          ))}
        </NativeSelect.Field>
        <NativeSelect.Indicator color="fg.muted" />
      </NativeSelect.Root>
    </Field.Root>
  );
}
