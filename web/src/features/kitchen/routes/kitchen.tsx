import type { UseQueryResult } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import { LoadFailed } from '@/components/ui/load-failed';
import { Loading } from '@/components/ui/loading';
import { Page } from '@/components/ui/page';
import { Panel } from '@/components/ui/panel';
import { useKitchen } from '@/api/kitchen';
import { useLabelSettings } from '@/api/label-settings';
import { usePublicPageSettings } from '@/api/public-page-settings';
import { useKitchenMakes } from '../api/get-kitchen-makes';
import { KitchenForm } from '../components/kitchen-form';
import { KitchenMakesView } from '../components/kitchen-makes';
import { LabelSettingsForm } from '../components/label-settings-form';
import { PublicPageForm } from '../components/public-page-form';

interface SettingsPanelProps<T> {
  title: string;
  query: UseQueryResult<T>;
  /** Said while it loads, and as the title of its failure. */
  loading: string;
  failed: string;
  children: (data: T) => ReactNode;
}

/** One panel of the page, over the query it shows: loading, failed with a retry, or its contents. */
function SettingsPanel<T>({ title, query, loading, failed, children }: SettingsPanelProps<T>) {
  return (
    <Panel title={title}>
      {query.isPending ? (
        <Loading size="sm">{loading}</Loading>
      ) : query.isError ? (
        <LoadFailed title={failed} error={query.error} onRetry={() => void query.refetch()} />
      ) : (
        children(query.data)
      )}
    </Panel>
  );
}

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
      <SettingsPanel
        title="Made differently here"
        query={makes}
        loading="Loading what this kitchen makes differently…"
        failed="What this kitchen makes differently could not be loaded"
      >
        {(data) => <KitchenMakesView makes={data} />}
      </SettingsPanel>
      <SettingsPanel
        title="Label settings"
        query={labelSettings}
        loading="Loading the label settings…"
        failed="The label settings could not be loaded"
      >
        {(data) => <LabelSettingsForm settings={data} />}
      </SettingsPanel>
      <SettingsPanel
        title="Public product page"
        query={publicPage}
        loading="Loading the public page settings…"
        failed="The public page settings could not be loaded"
      >
        {(data) => <PublicPageForm settings={data} />}
      </SettingsPanel>
    </Page>
  );
}
