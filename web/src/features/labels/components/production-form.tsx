import { Box, Button, HStack, Link, SimpleGrid, Stack, Table, Text } from '@chakra-ui/react';
import {
  expandBatchPattern,
  labelRunRequestSchema,
  type KitchenView,
  type LabelRun,
  type LabelSettings,
  type RecipeView,
  type ServedDeclaration,
} from '@crumbproof/shared';
import { useQueryClient } from '@tanstack/react-query';
import { useMemo, useState } from 'react';
import { Link as RouterLink } from 'react-router-dom';
import { getDeclarationQueryOptions } from '@/api/declaration';
import { getPublicPageSettingsQueryOptions } from '@/api/public-page-settings';
import { RadioInput } from '@/components/ui/choice-inputs';
import { ErrorAlert } from '@/components/ui/error-alert';
import { FormField, SelectInput, TextInput } from '@/components/ui/form-field';
import { isApiError } from '@/lib/api-client';
import { numberOrUndefined } from '@/lib/number-input';
import { runPdfUrl } from '../api/get-label-runs';
import { usePrintLabels } from '../api/print-labels';
import { chosenItems, previewPlan, printsBatch, toRunRequest, type RunDraft, type TemplateOption } from '../utils/run-plan';
import { LabelPreview, RefusalList, type PreviewState } from './label-preview';

/**
 * The public page's address for a template with a QR code block, while the page is on; null
 * otherwise; `readable` is false when its settings could not be read (the preview then says so).
 */
function usePublicBase() {
  const queryClient = useQueryClient();
  return async (template: TemplateOption): Promise<{ base: string | null; kitchen: string | null; readable: boolean }> => {
    const hasQr = template.blocks.some(
      (b) => b.type === 'qr' || (b.type === 'row' && b.columns.some((c) => c.blocks.some((x) => x.type === 'qr'))),
    );
    if (!hasQr) return { base: null, kitchen: null, readable: true };
    const page = await queryClient.fetchQuery(getPublicPageSettingsQueryOptions()).catch(() => null);
    return { base: page?.enabled ? page.baseUrl : null, kitchen: page?.kitchen ?? null, readable: page !== null };
  };
}

interface ProductionFormProps {
  products: readonly RecipeView[];
  templates: readonly TemplateOption[];
  settings: LabelSettings;
  kitchen: KitchenView;
  draft: RunDraft;
  onDraftChange: (draft: RunDraft) => void;
  /** A manager may print from a revision that is no longer current, with a reason. */
  canOverride: boolean;
}

const TEMPLATE_HINTS: Record<TemplateOption['purpose'], string> = {
  unit: 'One label per pack or item.',
  case: 'One label per wholesale case, with a GS1-128 barcode.',
  chart: 'One chart of every product against every allergen, for the counter.',
};

/** Today's production: what to print, previewed in the browser, then printed and logged by the API. */
export function ProductionForm({ products, templates, settings, kitchen, draft, onDraftChange, canOverride }: ProductionFormProps) {
  const publicBaseFor = usePublicBase();
  const queryClient = useQueryClient();
  const print = usePrintLabels();
  const [search, setSearch] = useState('');
  const [preview, setPreview] = useState<PreviewState>({ status: 'idle' });
  const [problems, setProblems] = useState<string[]>([]);
  const [printed, setPrinted] = useState<LabelRun | null>(null);

  const template = templates.find((t) => t.id === draft.template);
  const isCase = template?.purpose === 'case';
  const isChart = template?.purpose === 'chart';
  const names = useMemo(() => new Map(products.map((p) => [p.id, p.name])), [products]);
  const nameOf = (id: string) => names.get(id) ?? id;
  const reprint = Object.keys(draft.revisions).length > 0;

  const shown = useMemo(() => {
    const q = search.trim().toLowerCase();
    return products.filter((p) => q === '' || p.name.toLowerCase().includes(q) || p.id.includes(q) || (draft.quantities[p.id] ?? 0) > 0);
  }, [products, search, draft.quantities]);

  function change(patch: Partial<RunDraft>) {
    setPreview({ status: 'idle' });
    setPrinted(null);
    onDraftChange({ ...draft, ...patch });
  }

  /** The request, checked by the API's own schema; null (with the reasons shown) when it is not one. */
  function checkedRequest() {
    const request = toRunRequest(draft, products, template);
    const parsed = labelRunRequestSchema.safeParse(request);
    if (!parsed.success) {
      setProblems(
        parsed.error.issues.map((issue) => {
          const [head, index] = issue.path;
          const product = head === 'items' && typeof index === 'number' ? request.items[index]?.product : undefined;
          return product ? `${nameOf(product)}: ${issue.message}` : issue.message;
        }),
      );
      return null;
    }
    setProblems([]);
    return parsed.data;
  }

  async function handlePreview() {
    setPrinted(null);
    const request = checkedRequest();
    if (!request || !template) return;
    if (isChart) {
      setPreview({ status: 'blocked', message: 'The allergen chart is drawn by the server: print it to see it.' });
      return;
    }
    const publicBase = await publicBaseFor(template);
    const plan = previewPlan(request, products, settings, publicBase.base, publicBase.kitchen);
    if (!publicBase.readable)
      plan.notes.push('QR codes to the public product page are not shown: its settings could not be read. The print carries them.');
    if (plan.blocked) {
      setPreview({ status: 'blocked', message: plan.blocked });
      return;
    }
    setPreview({ status: 'drawing' });
    try {
      const declarations: ServedDeclaration[] = await Promise.all(
        request.items.map((item) => queryClient.fetchQuery(getDeclarationQueryOptions(item.product, undefined))),
      );
      const { renderPreview } = await import('../preview/render-preview');
      const result = await renderPreview({
        template,
        labels: plan.labels.map((label, i) => ({ ...label, declaration: declarations[i]! })),
        business: { name: kitchen.name, address: kitchen.address },
        regime: kitchen.regime,
        printedAt: new Date().toISOString(),
      });
      setPreview(
        result.ok
          ? { status: 'drawn', pdf: result.pdf, labels: result.labels, notes: plan.notes }
          : { status: 'refused', problems: result.problems },
      );
    } catch (error) {
      setPreview({
        status: 'blocked',
        message: `The preview could not be drawn: ${error instanceof Error ? error.message : String(error)}`,
      });
    }
  }

  function handlePrint() {
    setPrinted(null);
    const request = checkedRequest();
    if (!request) return;
    print.mutate(request, { onSuccess: (run) => setPrinted(run) });
  }

  const printError = print.isError ? print.error : null;
  const refusals =
    printError && isApiError(printError)
      ? printError.fields.map((f) => ({ message: f.message, product: productOfPath(f.path, draft, products) }))
      : [];
  const count = chosenItems(draft, products).length;

  return (
    <Stack gap="5">
      <SimpleGrid columns={{ base: 1, md: 2, xl: 3 }} gap="4">
        <FormField label="Template" hint={template ? TEMPLATE_HINTS[template.purpose] : undefined}>
          <SelectInput
            options={templates.map((t) => ({ value: t.id, label: t.title }))}
            value={draft.template}
            onChange={(e) => change({ template: e.currentTarget.value })}
          />
        </FormField>
        <FormField label="Production date" hint="The best before or use by date is counted from it.">
          <TextInput type="date" value={draft.productionDate} onChange={(e) => change({ productionDate: e.currentTarget.value })} />
        </FormField>
        {template && printsBatch(template) ? (
          <FormField label="Batch code for this run" hint={batchHint(settings, draft, products)}>
            <TextInput
              autoComplete="off"
              spellCheck={false}
              value={draft.batch}
              onChange={(e) => change({ batch: e.currentTarget.value })}
            />
          </FormField>
        ) : null}
      </SimpleGrid>

      {isCase ? (
        <Box as="fieldset" borderWidth="1px" borderColor="border.muted" rounded="md" p="4" minW="0">
          <Text as="legend" fontWeight="bold" px="1">
            Cases
          </Text>
          <SimpleGrid columns={{ base: 1, md: 2 }} gap="4">
            <FormField label="Units per case" hint="Leave empty to use each product’s own (from its print details).">
              <TextInput
                type="number"
                inputMode="numeric"
                min="1"
                step="1"
                textStyle="quantity"
                value={draft.unitsPerCase ?? ''}
                onChange={(e) => change({ unitsPerCase: numberOrUndefined(e.currentTarget.value) })}
              />
            </FormField>
            <Stack gap="0" role="radiogroup" aria-label="Case labels for">
              <Text fontWeight="bold">Case labels for</Text>
              <RadioInput
                name="case-kind"
                checked={!draft.shipment}
                onChange={() => change({ shipment: false })}
                hint="(01) the case GTIN-14, batch and date"
              >
                Trade-item cases
              </RadioInput>
              <RadioInput
                name="case-kind"
                checked={draft.shipment}
                onChange={() => change({ shipment: true })}
                hint="(00) an SSCC per case, (02) the content GTIN and (37) the count"
              >
                Shipment units (SSCC)
              </RadioInput>
            </Stack>
          </SimpleGrid>
        </Box>
      ) : null}

      <Stack gap="3">
        <Box maxW="md">
          <FormField label="Search products">
            <TextInput type="search" value={search} onChange={(e) => setSearch(e.currentTarget.value)} />
          </FormField>
        </Box>
        <Table.ScrollArea borderWidth="1px" borderColor="border.muted" rounded="md" bg="bg.panel" maxH="28rem">
          <Table.Root size="sm" stickyHeader>
            <Table.Caption captionSide="top" textAlign="start" fontWeight="bold" textStyle="md" px="4" py="2">
              Products for sale: give how many {isCase ? 'cases' : 'labels'} each needs
            </Table.Caption>
            <Table.Header>
              <Table.Row bg="bg.subtle">
                <Table.ColumnHeader bg="bg.subtle">Product and print details</Table.ColumnHeader>
                <Table.ColumnHeader bg="bg.subtle" textAlign="end">
                  {isCase ? 'Cases' : 'Labels'}
                </Table.ColumnHeader>
              </Table.Row>
            </Table.Header>
            <Table.Body>
              {shown.length === 0 ? (
                <Table.Row>
                  <Table.Cell colSpan={2} color="fg.muted">
                    {products.length === 0
                      ? 'No product is for sale yet: mark a recipe for sale in its editor.'
                      : 'No product matches the search.'}
                  </Table.Cell>
                </Table.Row>
              ) : (
                shown.map((product) => (
                  <Table.Row key={product.id}>
                    <Table.Cell verticalAlign="middle" whiteSpace="normal">
                      <Text fontWeight="bold">{product.name}</Text>
                      <Text color="fg.muted" textStyle="sm">
                        {draft.revisions[product.id] !== undefined
                          ? `Revision ${draft.revisions[product.id]}, as logged`
                          : `Revision ${product.revision}`}
                        {' · '}
                        {detailsSummary(product, isCase)}
                      </Text>
                    </Table.Cell>
                    <Table.Cell verticalAlign="middle" textAlign="end">
                      <TextInput
                        aria-label={`${isCase ? 'Cases' : 'Labels'} of ${product.name}`}
                        type="number"
                        inputMode="numeric"
                        min="0"
                        step="1"
                        w="7rem"
                        size="md"
                        textStyle="quantity"
                        value={draft.quantities[product.id] ?? ''}
                        onChange={(e) =>
                          change({ quantities: { ...draft.quantities, [product.id]: numberOrUndefined(e.currentTarget.value) } })
                        }
                      />
                    </Table.Cell>
                  </Table.Row>
                ))
              )}
            </Table.Body>
          </Table.Root>
        </Table.ScrollArea>
      </Stack>

      {reprint ? (
        <Box borderWidth="1px" borderColor="border.muted" rounded="md" p="4">
          <Stack gap="3">
            <Text>
              Printing again from the log: each product prints from the revision that run printed.{' '}
              <Link as="button" onClick={() => change({ revisions: {}, overrideReason: '' })}>
                Print from the current revisions instead
              </Link>
            </Text>
            {canOverride ? (
              <FormField
                label="Reason for printing a revision that is no longer current"
                hint="Needed only when a revision is no longer current; kept in the log with the run."
              >
                <TextInput value={draft.overrideReason} onChange={(e) => change({ overrideReason: e.currentTarget.value })} />
              </FormField>
            ) : (
              <Text color="fg.muted">Only a manager can print a revision that is no longer current, with a reason.</Text>
            )}
          </Stack>
        </Box>
      ) : null}

      {problems.length > 0 ? (
        <ErrorAlert title="Not ready to print">
          <RefusalList problems={problems.map((message) => ({ message }))} nameOf={nameOf} />
        </ErrorAlert>
      ) : null}
      {printError ? (
        <ErrorAlert title="Nothing was printed">
          <Text>{printError.message}</Text>
          {refusals.length > 0 ? <RefusalList problems={refusals} nameOf={nameOf} /> : null}
          {isApiError(printError) && printError.code === 'approval-needed' ? (
            <Text>
              Labels print only from an approved declaration.{' '}
              <Link asChild fontWeight="bold" color="fg">
                <RouterLink to="/approvals">Open Approvals</RouterLink>
              </Link>
            </Text>
          ) : null}
        </ErrorAlert>
      ) : null}

      <HStack gap="3" wrap="wrap">
        <Button size="lg" variant="outline" onClick={() => void handlePreview()} disabled={count === 0}>
          Preview
        </Button>
        <Button size="lg" onClick={handlePrint} loading={print.isPending} loadingText="Printing…" disabled={count === 0}>
          Print
        </Button>
        <Text role="status" color="fg.muted">
          {printed ? (
            <>
              Printed run {printed.id}, kept in the log.{' '}
              <Link href={runPdfUrl(printed.id)} fontWeight="bold" color="fg">
                Download the PDF of run {printed.id}
              </Link>
            </>
          ) : count === 0 ? (
            `Give a quantity for at least one product.`
          ) : (
            `${count === 1 ? '1 product' : `${count} products`} in this run.`
          )}
        </Text>
      </HStack>

      <Box>
        <LabelPreview state={preview} nameOf={nameOf} />
      </Box>
    </Stack>
  );
}

/** "Leave empty to use the kitchen's pattern: Lemon tart made on this day gets 261202-LEMONT-1, or the next free number." */
function batchHint(settings: LabelSettings, draft: RunDraft, products: readonly RecipeView[]): string {
  const product = chosenItems(draft, products)[0]?.product ?? products[0];
  if (!product || !/^\d{4}-\d{2}-\d{2}$/.test(draft.productionDate)) return 'Leave empty to use the kitchen’s batch code pattern.';
  const code = expandBatchPattern(settings.batchPattern, { date: draft.productionDate, product: product.id, sequence: 1 });
  return `Leave empty to use the kitchen’s pattern: ${product.name} gets ${code} (or the next free number that day).`;
}

/** "Use by, 3 days · GTIN 5012345678900 · 6 per case", or what is missing. */
function detailsSummary(product: RecipeView, isCase: boolean): string {
  const sale = product.sale;
  if (!sale) return '';
  const parts = [
    sale.dateMark && sale.shelfLifeDays
      ? `${sale.dateMark === 'use-by' ? 'Use by' : 'Best before'}, ${sale.shelfLifeDays} days`
      : 'No date mark',
    ...(isCase
      ? [
          sale.caseGtin ? `case GTIN ${sale.caseGtin}` : 'no case GTIN',
          sale.unitsPerCase ? `${sale.unitsPerCase} per case` : 'no units per case',
        ]
      : [sale.gtin ? `GTIN ${sale.gtin}` : 'no GTIN']),
  ];
  return parts.join(' · ');
}

/** The product a field of the request names ("items.1.product" → the second product printed). */
function productOfPath(path: string, draft: RunDraft, products: readonly RecipeView[]): string | undefined {
  const m = /^items\.(\d+)/.exec(path);
  if (!m) return undefined;
  return chosenItems(draft, products)[Number(m[1])]?.product.id;
}
