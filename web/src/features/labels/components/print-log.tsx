import { Box, Button, HStack, Link, SimpleGrid, Stack, Text } from '@chakra-ui/react';
import type { LabelRun, RecipeView } from '@crumbproof/shared';
import { useMemo, useState } from 'react';
import type { LabelRunSearch } from '@/api/query-keys';
import { DataTable, dataTableColumns } from '@/components/ui/data-table';
import { FormField, SelectInput, TextInput } from '@/components/ui/form-field';
import { LoadFailed } from '@/components/ui/load-failed';
import { Loading } from '@/components/ui/loading';
import { formatDate, formatDateTime } from '@/lib/format';
import { useDebouncedValue } from '@/lib/use-debounced-value';
import { runPdfUrl, useLabelRuns } from '../api/get-label-runs';

const column = dataTableColumns<LabelRun>();

const DATE_MARK_WORDS = { 'best-before': 'best before', 'use-by': 'use by' } as const;

function kilobytes(bytes: number): string {
  return bytes < 1024 ? `${bytes} bytes` : `${Math.round(bytes / 1024)} kB`;
}

interface PrintLogProps {
  products: readonly RecipeView[];
  templateTitle: (id: string) => string;
  /** Puts a logged run back into the form above, to print it again. */
  onPrintAgain: (run: LabelRun) => void;
}

/** Who printed what and when, with each run's PDF; searchable so that a recall finds every case of a batch. */
export function PrintLog({ products, templateTitle, onPrintAgain }: PrintLogProps) {
  const [form, setForm] = useState<LabelRunSearch>({ product: '', batch: '', from: '', to: '' });
  const search = useDebouncedValue(form, 300);
  const runs = useLabelRuns(search);

  const columns = useMemo(
    () => [
      column.accessor('printedAt', {
        header: 'Printed',
        cell: (info) => (
          <Stack gap="0">
            <Text>{formatDateTime(info.getValue())}</Text>
            <Text color="fg.muted" textStyle="sm">
              by {info.row.original.printedBy.name}
            </Text>
          </Stack>
        ),
      }),
      column.accessor('items', {
        header: 'What was printed',
        cell: (info) => (
          <Stack gap="1" minW="14rem" whiteSpace="normal">
            <Text color="fg.muted" textStyle="sm">
              {templateTitle(info.row.original.template)}, made {formatDate(info.row.original.productionDate)}
            </Text>
            <Stack as="ul" gap="1" m="0" ps="0" listStyleType="none">
              {info.getValue().map((item) => (
                <li key={item.product}>
                  <Text>
                    <Text as="span" fontWeight="bold">
                      {item.name}
                    </Text>{' '}
                    × {item.quantity}, revision {item.revision}
                  </Text>
                  <Text color="fg.muted" textStyle="sm">
                    {[
                      item.batch ? `batch ${item.batch}` : null,
                      item.date && item.dateMark ? `${DATE_MARK_WORDS[item.dateMark]} ${formatDate(item.date)}` : null,
                      item.sscc ? `SSCC ${item.sscc[0]} to ${item.sscc[1]}` : null,
                    ]
                      .filter(Boolean)
                      .join(' · ')}
                  </Text>
                </li>
              ))}
            </Stack>
          </Stack>
        ),
      }),
      column.display({
        id: 'status',
        header: 'Revision',
        cell: (info) => {
          const run = info.row.original;
          return (
            <Stack gap="1" maxW="12rem" whiteSpace="normal">
              <Text fontWeight={run.current ? undefined : 'bold'}>{run.current ? 'Current' : 'No longer current'}</Text>
              {run.override ? (
                <Text color="fg.muted" textStyle="sm">
                  Override: {run.override.reason}
                </Text>
              ) : null}
            </Stack>
          );
        },
      }),
      column.display({
        id: 'pdf',
        header: 'PDF',
        cell: (info) => {
          const run = info.row.original;
          return (
            <Stack gap="1" align="flex-start">
              <Link href={runPdfUrl(run.id)} fontWeight="bold" color="fg" aria-label={`PDF of run ${run.id}`}>
                Run {run.id} ({kilobytes(run.pdfBytes)})
              </Link>
              <Button size="sm" variant="outline" onClick={() => onPrintAgain(run)} aria-label={`Print run ${run.id} again`}>
                Print again
              </Button>
            </Stack>
          );
        },
      }),
    ],
    [templateTitle, onPrintAgain],
  );

  const set = (patch: Partial<LabelRunSearch>) => setForm((f) => ({ ...f, ...patch }));
  const productOptions = [{ value: '', label: 'Every product' }, ...products.map((p) => ({ value: p.id, label: p.name }))];

  return (
    <Stack gap="4">
      <SimpleGrid columns={{ base: 1, sm: 2, lg: 4 }} gap="4">
        <FormField label="Product">
          <SelectInput options={productOptions} value={form.product} onChange={(e) => set({ product: e.currentTarget.value })} />
        </FormField>
        <FormField label="Batch code">
          <TextInput type="search" autoComplete="off" value={form.batch} onChange={(e) => set({ batch: e.currentTarget.value })} />
        </FormField>
        <FormField label="Made on or after">
          <TextInput type="date" value={form.from} onChange={(e) => set({ from: e.currentTarget.value })} />
        </FormField>
        <FormField label="Made on or before">
          <TextInput type="date" value={form.to} onChange={(e) => set({ to: e.currentTarget.value })} />
        </FormField>
      </SimpleGrid>
      {runs.isPending ? (
        <Loading size="sm">Loading the print log…</Loading>
      ) : runs.isError ? (
        <LoadFailed title="The print log could not be loaded" error={runs.error} onRetry={() => void runs.refetch()} />
      ) : (
        <Box opacity={runs.isPlaceholderData ? 0.6 : 1}>
          <HStack justify="space-between" mb="2">
            <Text color="fg.muted" role="status">
              {runs.isFetching ? 'Searching the log…' : runs.data.length === 1 ? '1 run' : `${runs.data.length} runs`}
            </Text>
          </HStack>
          <DataTable
            caption="Print log, newest first"
            captionHidden
            columns={columns}
            data={runs.data}
            getRowId={(run) => String(run.id)}
            empty="No run matches the search."
            rowTone={(run) => (run.current ? undefined : 'attention')}
          />
        </Box>
      )}
    </Stack>
  );
}
