import { LoadFailed } from '@/components/ui/load-failed';
import { Loading } from '@/components/ui/loading';
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
        <Loading>Loading the kitchen…</Loading>
      ) : kitchen.isError ? (
        <LoadFailed title="The kitchen could not be loaded" error={kitchen.error} onRetry={() => void kitchen.refetch()} />
      ) : (
        <KitchenForm kitchen={kitchen.data} />
      )}
    </Page>
  );
}
