import { LoadFailed } from '@/components/ui/load-failed';
import { Loading } from '@/components/ui/loading';
import { Page } from '@/components/ui/page';
import { Panel } from '@/components/ui/panel';
import { useKitchen } from '@/api/kitchen';
import { useLabelSettings } from '@/api/label-settings';
import { useKitchenMakes } from '../api/get-kitchen-makes';
import { KitchenForm } from '../components/kitchen-form';
import { KitchenMakesView } from '../components/kitchen-makes';
import { usePublicPageSettings } from '@/api/public-page-settings';
import { LabelSettingsForm } from '../components/label-settings-form';
import { PublicPageForm } from '../components/public-page-form';

/** /kitchen — the manager's settings for the whole kitchen. */
export function KitchenRoute() {
  const kitchen = useKitchen();
  const labelSettings = useLabelSettings();
  const publicPage = usePublicPageSettings();
  const makes = useKitchenMakes();
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
      <Panel title="Made differently here">
        {makes.isPending ? (
          <Loading size="sm">Loading what this kitchen makes differently…</Loading>
        ) : makes.isError ? (
          <LoadFailed
            title="What this kitchen makes differently could not be loaded"
            error={makes.error}
            onRetry={() => void makes.refetch()}
          />
        ) : (
          <KitchenMakesView makes={makes.data} />
        )}
      </Panel>
      <Panel title="Label settings">
        {labelSettings.isPending ? (
          <Loading size="sm">Loading the label settings…</Loading>
        ) : labelSettings.isError ? (
          <LoadFailed
            title="The label settings could not be loaded"
            error={labelSettings.error}
            onRetry={() => void labelSettings.refetch()}
          />
        ) : (
          <LabelSettingsForm settings={labelSettings.data} />
        )}
      </Panel>
      <Panel title="Public product page">
        {publicPage.isPending ? (
          <Loading size="sm">Loading the public page settings…</Loading>
        ) : publicPage.isError ? (
          <LoadFailed
            title="The public page settings could not be loaded"
            error={publicPage.error}
            onRetry={() => void publicPage.refetch()}
          />
        ) : (
          <PublicPageForm settings={publicPage.data} />
        )}
      </Panel>
    </Page>
  );
}
