import { Box, Button, HStack, Link, Stack, Text } from '@chakra-ui/react';
import {
  IMPORT_COLUMNS,
  IMPORT_RULES,
  type ImportCounts,
  type ImportPreview,
  type ImportResult,
  type StaleImportRow,
} from '@crumbproof/shared';
import { useRef, useState, type FormEvent } from 'react';
import { Link as RouterLink } from 'react-router-dom';
import { ErrorAlert } from '@/components/ui/error-alert';
import { FormField, TextInput } from '@/components/ui/form-field';
import { Page } from '@/components/ui/page';
import { isApiError } from '@/lib/api-client';
import { withKitchen } from '@/lib/kitchen-choice';
import { formatDateTime } from '@/lib/format';
import { useImportIngredients } from '../api/import-ingredients';
import { usePreviewImport } from '../api/preview-import';
import { ImportPreviewTable } from '../components/import-preview-table';

const ACCEPT = '.csv,.xlsx,text/csv,application/vnd.openxmlformats-officedocument.spreadsheetml.sheet';

function plural(count: number, one: string, many: string): string {
  return `${count} ${count === 1 ? one : many}`;
}

function describeSummary(summary: ImportCounts): string {
  return [
    `${summary.create} new`,
    `${summary.update} revised`,
    `${summary.unchanged} unchanged`,
    `${plural(summary.withProblems, 'row', 'rows')} with problems (not imported)`,
  ].join(', ');
}

/** What the import would do once nothing blocks it: "12 ingredients: 3 new, 9 revised". */
function importWhat(summary: ImportCounts): string {
  return `${plural(summary.create + summary.update, 'ingredient', 'ingredients')}: ${summary.create} new, ${summary.update} revised`;
}

/**
 * What the import button does: "Import 12 ingredients: 3 new, 9 revised". The import is all or
 * nothing, so while a row has a problem the button says that nothing will be imported.
 */
function importButtonWords(summary: ImportCounts, blocked: boolean): string {
  if (blocked)
    return summary.withProblems > 0
      ? `Nothing is imported while ${plural(summary.withProblems, 'row has a problem', 'rows have problems')}`
      : 'Nothing is imported while the file has problems';
  if (summary.create + summary.update === 0) return 'Nothing to import';
  return `Import ${importWhat(summary)}`;
}

const TEMPLATE_URL = '/api/ingredients/import/template';

/** Every column the import reads and what it means, from the list the import itself reads by. */
function ColumnList({ columns }: { columns: ImportPreview['columns'] }) {
  return (
    <Box as="ul" ps="5" m="0" aria-label="Columns the import reads">
      {columns.map((column) => (
        <li key={column.header}>
          <Text as="span" fontWeight="bold">
            {column.header}
          </Text>
          {column.required ? ' (required)' : ''}
          {`: ${column.description}`}
        </li>
      ))}
    </Box>
  );
}

/** Before the first upload: the templates to start from, the columns and how the file is read. */
function ImportGuide() {
  return (
    <Stack gap="3" maxW="4xl" borderWidth="1px" borderColor="border.muted" rounded="md" p="4" bg="bg.panel">
      <Text as="h2" fontWeight="bold" textStyle="lg">
        Start from a template
      </Text>
      <Text>
        Download a template, fill in one ingredient per row under the header, and check the file here. The workbook has a second sheet
        saying what each column means.
      </Text>
      <HStack gap="4" flexWrap="wrap">
        <Link href={withKitchen(`${TEMPLATE_URL}.xlsx`)} download color="accent.fg" fontWeight="bold">
          Template for Excel (.xlsx)
        </Link>
        <Link href={withKitchen(`${TEMPLATE_URL}.csv`)} download color="accent.fg" fontWeight="bold">
          Template as CSV
        </Link>
      </HStack>
      <Text as="h3" fontWeight="bold">
        Columns
      </Text>
      <Text textStyle="sm">Only id and name are required; leave out any other column you do not use.</Text>
      <Box textStyle="sm">
        <ColumnList columns={IMPORT_COLUMNS} />
      </Box>
      <Text as="h3" fontWeight="bold">
        How the file is read
      </Text>
      <Box as="ul" ps="5" m="0" textStyle="sm">
        {IMPORT_RULES.map((rule, index) => (
          <li key={index}>{rule}</li>
        ))}
      </Box>
    </Stack>
  );
}

function errorText(error: unknown, fallback: string): string[] {
  if (!isApiError(error)) return [fallback];
  if (error.status === 413) return ['The file is too large to import. Split it into smaller files and import each.'];
  return [error.message, ...error.fields.map((field) => `${field.path}: ${field.message}`)];
}

function ImportHelp({ columns, rules }: { columns: ImportPreview['columns']; rules: string[] }) {
  if (columns.length === 0 && rules.length === 0) return null;
  return (
    <Box as="details" borderWidth="1px" borderColor="border.muted" rounded="md" p="3" bg="bg.panel">
      <Box as="summary" fontWeight="bold" cursor="pointer">
        How the spreadsheet is read
      </Box>
      <Stack gap="3" mt="3" textStyle="sm">
        {rules.length > 0 ? (
          <Box as="ul" ps="5" m="0">
            {rules.map((rule, index) => (
              <li key={index}>{rule}</li>
            ))}
          </Box>
        ) : null}
        {columns.length > 0 ? (
          <Box>
            <Text fontWeight="bold">Columns</Text>
            <ColumnList columns={columns} />
          </Box>
        ) : null}
      </Stack>
    </Box>
  );
}

/** "Row 2, caster-sugar: Maren Holloway saved revision 4 on 2 Dec 2026, 16:20; the check compared it with revision 3." */
function staleRowWords(stale: StaleImportRow): string {
  const who = stale.authorName ?? 'Someone without a kitchen account';
  const what =
    stale.currentRevision === null
      ? 'it is no longer in the library'
      : stale.previewRevision === null
        ? `${who} created it`
        : `${who} saved revision ${stale.currentRevision}`;
  const when = stale.savedAt ? ` on ${formatDateTime(stale.savedAt)}` : '';
  const compared =
    stale.previewRevision === null ? 'the check found no such ingredient' : `the check compared it with revision ${stale.previewRevision}`;
  return `Row ${stale.row}, ${stale.id}: ${what}${when}; ${compared}.`;
}

/** The import refused because ingredients changed after the check: which rows, who and when, and a new check. */
function StalePreviewAlert({ rows, onCheckAgain, checking }: { rows: StaleImportRow[]; onCheckAgain: () => void; checking: boolean }) {
  return (
    <ErrorAlert title="Someone saved these ingredients after your check: nothing was imported">
      <Stack gap="2">
        <Box as="ul" ps="5" m="0" aria-label="Rows whose ingredient changed since the check">
          {rows.map((row) => (
            <li key={row.row}>{staleRowWords(row)}</li>
          ))}
        </Box>
        <Text>Check the file again to see what it would change now, then import.</Text>
        <Button alignSelf="flex-start" variant="outline" onClick={onCheckAgain} loading={checking} loadingText="Checking…">
          Check the file again
        </Button>
      </Stack>
    </ErrorAlert>
  );
}

export function ImportIngredientsRoute() {
  const fileRef = useRef<HTMLInputElement>(null);
  const [file, setFile] = useState<File | null>(null);
  const [fileError, setFileError] = useState<string | undefined>();
  const [preview, setPreview] = useState<ImportPreview | null>(null);
  const [imported, setImported] = useState<ImportResult | null>(null);
  const previewImport = usePreviewImport();
  const importIngredients = useImportIngredients();

  function handleCheck(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    setImported(null);
    importIngredients.reset();
    const chosen = fileRef.current?.files?.[0];
    if (!chosen) {
      setFileError('Choose a spreadsheet first: a CSV file, or an Excel workbook (.xlsx).');
      return;
    }
    setFileError(undefined);
    setFile(chosen);
    check(chosen);
  }

  function check(chosen: File) {
    setPreview(null);
    previewImport.mutate(chosen, { onSuccess: setPreview });
  }

  function checkAgain() {
    if (!file) return;
    importIngredients.reset();
    check(file);
  }

  function handleImport() {
    if (!file || !preview) return;
    importIngredients.mutate(
      { file, basis: preview.basis },
      {
        onSuccess: (summary) => {
          setImported(summary);
          setPreview(null);
          setFile(null);
          if (fileRef.current) fileRef.current.value = '';
        },
      },
    );
  }

  const staleRows =
    importIngredients.isError && isApiError(importIngredients.error) && importIngredients.error.code === 'stale-preview'
      ? importIngredients.error.staleRows
      : [];
  // Rows that would change something; the summary counts only rows without problems.
  const count = preview ? preview.summary.create + preview.summary.update : 0;
  const fileProblems = preview?.problems ?? [];
  const blocked = preview
    ? fileProblems.length > 0 || preview.summary.withProblems > 0 || preview.rows.some((row) => row.problems.length > 0)
    : true;

  return (
    <Page
      title="Import from spreadsheet"
      lead="Add or update many ingredients at once. Crumbproof checks every row first; nothing is saved until you import, and nothing at all if any row has a problem."
      actions={
        <Link asChild color="accent.fg">
          <RouterLink to="/ingredients">← All ingredients</RouterLink>
        </Link>
      }
    >
      <Box maxW="2xl">
        <form aria-label="Choose a spreadsheet" noValidate onSubmit={handleCheck}>
          <Stack gap="3">
            <FormField
              label="Spreadsheet (CSV or XLSX)"
              hint="One ingredient per row, with a header row naming the columns."
              error={fileError}
            >
              <TextInput
                ref={fileRef}
                type="file"
                accept={ACCEPT}
                p="1.5"
                onChange={() => {
                  setPreview(null);
                  setImported(null);
                }}
              />
            </FormField>
            <Button
              type="submit"
              size="lg"
              alignSelf="flex-start"
              variant="outline"
              loading={previewImport.isPending}
              loadingText="Checking…"
            >
              Check the file
            </Button>
          </Stack>
        </form>
      </Box>

      {previewImport.isError ? (
        <ErrorAlert title="The file could not be checked">
          {errorText(previewImport.error, 'Try again in a moment.').map((line, index) => (
            <Text key={index}>{line}</Text>
          ))}
        </ErrorAlert>
      ) : null}

      {imported ? (
        <Box role="status" borderStartWidth="4px" borderColor="accent.solid" bg="accent.subtle" p="4" rounded="md">
          <Text fontWeight="bold">
            Imported {plural(imported.create + imported.update, 'ingredient', 'ingredients')}: {imported.create} added, {imported.update}{' '}
            updated
            {imported.unchanged > 0 ? `, ${imported.unchanged} unchanged` : ''}.
          </Text>
          <Link asChild color="accent.fg">
            <RouterLink to="/ingredients">See them in the ingredient library</RouterLink>
          </Link>
        </Box>
      ) : null}

      {!preview && !imported && !previewImport.isPending ? <ImportGuide /> : null}

      {preview ? (
        <Stack gap="4">
          <Text role="status" fontWeight="bold">
            {file?.name ? `${file.name}: ` : ''}
            {describeSummary(preview.summary)}.
          </Text>
          {fileProblems.length > 0 ? (
            <ErrorAlert title="The file as a whole has problems">
              {fileProblems.map((line, index) => (
                <Text key={index}>{line}</Text>
              ))}
            </ErrorAlert>
          ) : null}
          {preview.rows.length > 0 ? <ImportPreviewTable preview={preview} /> : null}
          <ImportHelp columns={preview.columns} rules={preview.rules} />
          {staleRows.length > 0 ? (
            <StalePreviewAlert rows={staleRows} onCheckAgain={checkAgain} checking={previewImport.isPending} />
          ) : importIngredients.isError ? (
            <ErrorAlert title="Nothing was imported">
              {errorText(importIngredients.error, 'Try again in a moment.').map((line, index) => (
                <Text key={index}>{line}</Text>
              ))}
            </ErrorAlert>
          ) : null}
          <HStack gap="4" flexWrap="wrap">
            <Button
              size="lg"
              disabled={blocked || count === 0}
              loading={importIngredients.isPending}
              loadingText="Importing…"
              onClick={handleImport}
            >
              {importButtonWords(preview.summary, blocked)}
            </Button>
            <Text color="fg.muted">
              {blocked
                ? preview.summary.withProblems > 0
                  ? `The import is all or nothing. Correct the rows with problems in the spreadsheet, then check the file again: the other rows would import ${importWhat(preview.summary)}.`
                  : 'The import is all or nothing. Correct the problems of the file named above, then check it again.'
                : count === 0
                  ? 'Every row matches what is already saved: there is nothing to import.'
                  : null}
            </Text>
          </HStack>
        </Stack>
      ) : null}
    </Page>
  );
}
