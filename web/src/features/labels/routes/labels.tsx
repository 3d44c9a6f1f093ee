import { Stack } from '@chakra-ui/react';
import type { LabelRun } from '@crumbproof/shared';
import { useCallback, useMemo, useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { useKitchen } from '@/api/kitchen';
import { useLabelSettings } from '@/api/label-settings';
import { useRecipes } from '@/api/recipes';
import { LoadFailed } from '@/components/ui/load-failed';
import { Loading } from '@/components/ui/loading';
import { Page } from '@/components/ui/page';
import { Panel } from '@/components/ui/panel';
import { useSignedInUser } from '@/lib/signed-in-user';
import { useLabelTemplates } from '../api/get-label-templates';
import { PrintLog } from '../components/print-log';
import { ProductionForm } from '../components/production-form';
import type { RunDraft } from '../utils/run-plan';

/** Today, as the kitchen's calendar date (the browser's own day, not UTC's). */
function today(): string {
  const now = new Date();
  return `${now.getFullYear()}-${String(now.getMonth() + 1).padStart(2, '0')}-${String(now.getDate()).padStart(2, '0')}`;
}

function emptyDraft(template: string): RunDraft {
  return {
    template,
    productionDate: today(),
    batch: '',
    quantities: {},
    revisions: {},
    unitsPerCase: undefined,
    shipment: false,
    overrideReason: '',
  };
}

/** /labels — today's production previewed and printed, and the print log. */
export function LabelsRoute() {
  const me = useSignedInUser();
  const recipes = useRecipes();
  const templates = useLabelTemplates();
  const settings = useLabelSettings();
  const kitchen = useKitchen();
  const [draft, setDraft] = useState<RunDraft | null>(null);

  const products = useMemo(() => (recipes.data ?? []).filter((r) => r.sale !== undefined), [recipes.data]);
  const titles = useMemo(() => new Map((templates.data ?? []).map((t) => [t.id, t.title])), [templates.data]);
  const templateTitle = useCallback((id: string) => titles.get(id) ?? id, [titles]);
  // `?template=chart` (the counter's "Print the allergen chart") opens with that template picked.
  const [search] = useSearchParams();
  const asked = templates.data?.find((t) => t.id === search.get('template'))?.id;
  const first = asked ?? templates.data?.[0]?.id ?? '';
  const current = draft ?? emptyDraft(first);

  const printAgain = useCallback((run: LabelRun) => {
    setDraft({
      ...emptyDraft(run.template),
      productionDate: run.productionDate,
      quantities: Object.fromEntries(run.items.map((item) => [item.product, item.quantity])),
      revisions: Object.fromEntries(run.items.map((item) => [item.product, item.revision])),
    });
    window.scrollTo({ top: 0, behavior: 'smooth' });
  }, []);

  const failed = [recipes, templates, settings, kitchen].find((q) => q.isError);
  return (
    <Page
      title="Labels"
      lead="Print today’s labels from each product’s current declaration, once a manager has approved it. Every run is kept in the log below with its PDF."
    >
      <Panel title="Today’s production">
        {failed?.error ? (
          <LoadFailed title="The labels cannot be prepared" error={failed.error} onRetry={() => void failed.refetch()} />
        ) : !recipes.data || !templates.data || !settings.data || !kitchen.data ? (
          <Loading size="sm">Loading the products and templates…</Loading>
        ) : (
          <ProductionForm
            products={products}
            templates={templates.data}
            settings={settings.data}
            kitchen={kitchen.data}
            draft={current}
            onDraftChange={setDraft}
            canOverride={me.role === 'manager'}
          />
        )}
      </Panel>
      <Panel title="Print log">
        <Stack gap="3">
          <PrintLog products={products} templateTitle={templateTitle} onPrintAgain={printAgain} />
        </Stack>
      </Panel>
    </Page>
  );
}
