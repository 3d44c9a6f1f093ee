import { Spinner, Stack, Text } from '@chakra-ui/react';
import { ErrorAlert } from '@/components/ui/error-alert';
import { Page } from '@/components/ui/page';
import { useKitchen } from '@/api/kitchen';
import { KitchenForm } from '../components/kitchen-form';

/** /kitchen — the manager's settings for the whole kitchen. */
export function KitchenRoute() {
  const kitchen = useKitchen();
  return (
    <Page
      title="Kitchen"
      lead="The law this kitchen declares under, and how it handles each allergen source. Every declaration follows these settings."
    >
      {kitchen.isPending ? (
        <Stack role="status" direction="row" align="center" gap="3">
          <Spinner color="accent.solid" />
          <Text>Loading the kitchen…</Text>
        </Stack>
      ) : kitchen.isError ? (
        <ErrorAlert title="The kitchen could not be loaded">{kitchen.error.message}</ErrorAlert>
      ) : (
        <KitchenForm kitchen={kitchen.data} />
      )}
    </Page>
  );
}
