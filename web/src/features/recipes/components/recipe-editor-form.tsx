import { Box, Button, Grid, SimpleGrid, Stack, Text } from '@chakra-ui/react';
import { hasEdits, useUnsavedChanges } from '@/lib/unsaved-changes';
import {
  bookRecipeSchema,
  CLAIM_LABELS,
  CLAIMS,
  type BookRecipe,
  type DeclarationNotice,
  type RecipeView,
  type StaleBase,
} from '@crumbproof/shared';
import { useMemo, useState } from 'react';
import { useFieldArray, useForm, useWatch } from 'react-hook-form';
import { CheckboxInput as Checkbox } from '@/components/ui/choice-inputs';
import { ErrorAlert } from '@/components/ui/error-alert';
import { FormField, TextInput } from '@/components/ui/form-field';
import { StaleSavePanel } from '@/components/ui/stale-save-panel';
import type { ComboboxOption } from '@/components/ui/item-combobox';
import type { ItemLookup } from '@/components/ui/layer-path';
import { useLabelSettings } from '@/api/label-settings';
import { isApiError } from '@/lib/api-client';
import { useDebouncedValue } from '@/lib/use-debounced-value';
import { usePreviewDeclaration } from '../api/preview-declaration';
import { useSaveRecipe } from '../api/save-recipe';
import { editorResolver, numberOrUndefined, PRINT_DETAIL_FIELDS, toBookRecipe, toEditorValues, type EditorValues } from './editor-values';
import { lineProblems } from './line-problems';
import { LineRows } from './line-rows';
import { LiveDeclaration } from './live-declaration';
import { LiveDeclarationSummary } from './live-declaration-summary';
import { PrintDetailsFields } from './print-details-fields';

/** The id a new recipe is previewed under until it has one of its own. */
const PREVIEW_ID = 'new-recipe-preview';
export const PREVIEW_DELAY_MS = 400;

interface RecipeEditorFormProps {
  /** The recipe as saved; null for a new one. */
  initial: RecipeView | null;
  options: readonly ComboboxOption[];
  lookup: ItemLookup;
  onSaved: (saved: RecipeView) => void;
}

/** A short sentence on what stops the preview, from the form's own validation. */
function firstIssue(recipe: BookRecipe): string | null {
  const parsed = bookRecipeSchema.safeParse(recipe);
  if (parsed.success) return null;
  const issue = parsed.error.issues[0];
  if (!issue) return null;
  const [head, index, field] = issue.path;
  if (head === 'lines' && typeof index === 'number') {
    const what = field === 'use' ? 'choose an ingredient or recipe' : field === 'qty' ? 'give a quantity above zero' : 'finish it';
    return `Line ${index + 1}: ${what} to see the declaration.`;
  }
  if (head === 'sale' && index === 'portionG') return 'Give the portion weight to see the declaration for sale.';
  if (head === 'sale') return `Correct the sale details to see the declaration: ${issue.message}`;
  return `Finish the form to see the declaration: ${issue.message}`;
}

/** The declaration's warnings that name a line of the recipe (1-based), by 0-based index. */
function warningsByLine(warnings: readonly DeclarationNotice[]): Map<number, string[]> {
  const byLine = new Map<number, string[]>();
  for (const w of warnings) if (w.line !== undefined) byLine.set(w.line - 1, [...(byLine.get(w.line - 1) ?? []), w.message]);
  return byLine;
}

export function RecipeEditorForm({ initial, options, lookup, onSaved }: RecipeEditorFormProps) {
  const creating = initial === null;
  const defaults = useMemo(() => toEditorValues(initial), [initial]);
  const {
    control,
    register,
    handleSubmit,
    setError,
    setValue,
    reset,
    formState: { errors, isDirty, dirtyFields },
  } = useForm<EditorValues>({ resolver: editorResolver, defaultValues: defaults });
  const lines = useFieldArray({ control, name: 'lines' });
  const guard = useUnsavedChanges(hasEdits(dirtyFields));
  const save = useSaveRecipe();
  const labelSettings = useLabelSettings();
  // A refused save stays on screen until the recipe changes: it is kept with the recipe it refused.
  const [refused, setRefused] = useState<{ recipeKey: string; message: string } | null>(null);
  // The revision the form was loaded from; a save names it, and only a reload or a new save moves it on.
  const [base, setBase] = useState(initial?.revision ?? 0);
  const [stale, setStale] = useState<StaleBase | null>(null);
  const [reloaded, setReloaded] = useState<string | null>(null);

  const watched = useWatch({ control }) as EditorValues;
  const forSale = Boolean(watched.forSale);
  const wantedClaims = Array.isArray(watched.claims) ? watched.claims : watched.claims ? [watched.claims] : [];

  // The preview: the recipe as it would be sent, once typing pauses.
  const asTyped = toBookRecipe(watched);
  const forPreview: BookRecipe = { ...asTyped, id: asTyped.id || PREVIEW_ID, name: asTyped.name.trim() || 'New recipe' };
  const previewKey = JSON.stringify(forPreview);
  const settledKey = useDebouncedValue(previewKey, PREVIEW_DELAY_MS);
  const settled = useMemo(() => JSON.parse(settledKey) as BookRecipe, [settledKey]);
  const incomplete = firstIssue(settled);
  const preview = usePreviewDeclaration(incomplete ? null : settled, undefined);
  const previewError = preview.isError && isApiError(preview.error) ? preview.error : null;

  const refusedNow = refused?.recipeKey === previewKey ? refused : null;
  const saveMessage = refusedNow?.message ?? null;
  const saveError = refusedNow && save.isError && isApiError(save.error) ? save.error : null;
  const shownError = saveError ?? previewError;
  const apiLineErrors = lineProblems(
    shownError,
    forPreview.id,
    (watched.lines ?? []).map((line) => line.use),
  );
  const lineWarnings = useMemo(() => warningsByLine(preview.data?.warnings ?? []), [preview.data]);
  const { id: previewId, name: previewName } = forPreview;
  const previewLookup = useMemo<ItemLookup>(
    () => (id) => (id === previewId ? { name: previewName, kind: 'recipe' } : lookup(id)),
    [lookup, previewId, previewName],
  );

  function handleSave(values: EditorValues, baseRevision = base) {
    setRefused(null);
    setStale(null);
    setReloaded(null);
    const recipeKey = previewKey;
    const setSaveMessage = (message: string) => setRefused({ recipeKey, message });
    const recipe = toBookRecipe(values);
    save.mutate(creating ? { recipe } : { recipe, code: initial.id, baseRevision }, {
      onSuccess: (saved) => {
        guard.release();
        onSaved(saved);
      },
      onError: (error) => {
        if (!isApiError(error)) {
          setSaveMessage('Nothing was saved. Try again in a moment.');
          return;
        }
        if (error.code === 'stale-base' && error.stale) {
          setStale(error.stale);
          return;
        }
        if (error.code === 'conflict') setError('id', { message: error.message });
        for (const field of error.fields) {
          if (field.path === 'name' || field.path === 'finishedWeightG') setError(field.path, { message: field.message });
          if (field.path === 'id' && creating) setError('id', { message: field.message });
          if (field.path === 'sale.portionG') setError('portionG', { message: field.message });
          for (const detail of PRINT_DETAIL_FIELDS) if (field.path === `sale.${detail}`) setError(detail, { message: field.message });
        }
        setSaveMessage(`Nothing was saved. ${error.message}`);
      },
    });
  }

  /** Moves the base on to their revision: the form shows it, or keeps the person's values to save over it. */
  function moveBase(theirs: StaleBase) {
    setBase(theirs.currentRevision);
    setStale(null);
  }

  function reloadTheirs(theirs: StaleBase) {
    moveBase(theirs);
    reset(toEditorValues(theirs.current as BookRecipe));
    setReloaded(`Showing revision ${theirs.currentRevision}, as ${theirs.saves.at(-1)?.authorName ?? 'they'} saved it.`);
  }

  function saveMineOver(theirs: StaleBase) {
    moveBase(theirs);
    void handleSubmit((values) => handleSave(values, theirs.currentRevision))();
  }

  const lineOptions = useMemo(() => {
    const seen = new Set<string>();
    return (watched.lines ?? [])
      .map((line) => line.use)
      .filter((use) => use && !seen.has(use) && seen.add(use))
      .map((use) => ({ id: use, name: lookup(use)?.name ?? use }));
  }, [watched.lines, lookup]);

  const computing = preview.isFetching || previewKey !== settledKey;
  const declarationError = previewError
    ? previewError.message
    : preview.isError
      ? 'The declaration could not be computed. Try again in a moment.'
      : null;
  const liveDeclaration = (
    <LiveDeclaration
      declaration={preview.data}
      computing={computing}
      unsaved={creating || isDirty}
      incomplete={incomplete}
      error={declarationError}
      wantedClaims={forSale ? wantedClaims : []}
      forSale={forSale}
      lookup={previewLookup}
    />
  );

  return (
    <Grid
      // From 1280 px the side panel takes 24rem, room for the US nutrition table's % Daily Value;
      // narrower, the line table needs the whole width, so the panel folds into the sticky summary.
      templateColumns={{ base: 'minmax(0, 1fr)', xl: 'minmax(0, 1fr) minmax(0, 24rem)' }}
      gap={{ base: '6', xl: '4' }}
      alignItems="start"
    >
      {/* Narrow screens: the side panel would sit below the whole form, so a summary stays in view instead. */}
      <Box hideFrom="xl" position="sticky" top="0" zIndex="sticky" minW="0">
        <LiveDeclarationSummary
          declaration={preview.data}
          computing={computing}
          unsaved={creating || isDirty}
          problem={declarationError ?? incomplete}
          wantedClaims={forSale ? wantedClaims : []}
        >
          {liveDeclaration}
        </LiveDeclarationSummary>
      </Box>
      <form
        aria-label={creating ? 'New recipe' : `Edit ${initial.name}`}
        noValidate
        onSubmit={handleSubmit((values) => handleSave(values))}
      >
        <Stack gap="5" minW="0">
          {stale ? (
            <StaleSavePanel
              stale={stale}
              saving={save.isPending}
              onReload={() => reloadTheirs(stale)}
              onSaveMine={() => saveMineOver(stale)}
            />
          ) : null}
          {reloaded ? <Text role="status">{reloaded}</Text> : null}
          {saveMessage ? <ErrorAlert title="The recipe was not saved">{saveMessage}</ErrorAlert> : null}
          <SimpleGrid columns={{ base: 1, md: 2 }} gap="4">
            <FormField label="Recipe name" error={errors.name?.message} required>
              <TextInput autoComplete="off" {...register('name')} />
            </FormField>
            {creating ? (
              <FormField
                label="Recipe id"
                hint="Short and lasting, e.g. lemon-tart. It cannot be changed later."
                error={errors.id?.message}
                required
              >
                <TextInput autoComplete="off" spellCheck={false} {...register('id')} />
              </FormField>
            ) : (
              <Box>
                <Text fontWeight="bold">Recipe id</Text>
                <Text textStyle="quantity" pt="2">
                  {initial.id}
                </Text>
              </Box>
            )}
          </SimpleGrid>

          <LineRows
            control={control}
            register={register}
            lines={lines}
            errors={errors}
            apiErrors={apiLineErrors}
            lineWarnings={lineWarnings}
            options={options}
          />

          <Box maxW="xs">
            <FormField
              label="Weight after baking (g)"
              hint="Leave empty to use the sum of the lines."
              error={errors.finishedWeightG?.message}
            >
              <TextInput
                type="number"
                inputMode="decimal"
                step="any"
                min="0"
                textStyle="quantity"
                {...register('finishedWeightG', { setValueAs: numberOrUndefined })}
              />
            </FormField>
          </Box>

          <Box as="fieldset" borderWidth="1px" borderColor="border.muted" rounded="md" p="4" bg="bg.panel" minW="0">
            <Text as="legend" fontWeight="bold" px="1">
              Sale details
            </Text>
            <Stack gap="4">
              <Checkbox {...register('forSale')}>For sale</Checkbox>
              {forSale ? (
                <>
                  <Box maxW="xs">
                    <FormField label="Portion (g)" error={errors.portionG?.message} required>
                      <TextInput
                        type="number"
                        inputMode="decimal"
                        step="any"
                        min="0"
                        textStyle="quantity"
                        {...register('portionG', { setValueAs: numberOrUndefined })}
                      />
                    </FormField>
                  </Box>
                  <Checkbox
                    {...register('published')}
                    hint="Its page on the kitchen’s public product page, when the manager has the page on; its counter tickets then carry a QR code to it."
                  >
                    Published on the public page
                  </Checkbox>
                  <Box as="fieldset" minW="0">
                    <Text as="legend" fontWeight="bold">
                      Claims you want to make
                    </Text>
                    <Text color="fg.muted" textStyle="sm">
                      The kitchen’s intent. Whether the recipe supports each claim is worked out under “What the recipe supports” below.
                    </Text>
                    <SimpleGrid columns={{ base: 2, md: 4 }} gapX="4">
                      {CLAIMS.map((claim) => (
                        <Checkbox key={claim} value={claim} {...register('claims')}>
                          {CLAIM_LABELS[claim]}
                        </Checkbox>
                      ))}
                    </SimpleGrid>
                  </Box>
                  <Box as="fieldset" minW="0">
                    <Text as="legend" fontWeight="bold">
                      Give a percentage for (QUID)
                    </Text>
                    {lineOptions.length === 0 ? (
                      <Text color="fg.muted">Add lines first.</Text>
                    ) : (
                      <SimpleGrid columns={{ base: 1, md: 2 }} gapX="4">
                        {lineOptions.map((option) => (
                          <Checkbox key={option.id} value={option.id} {...register('quid')}>
                            {option.name}
                          </Checkbox>
                        ))}
                      </SimpleGrid>
                    )}
                  </Box>
                  <PrintDetailsFields
                    register={register}
                    control={control}
                    setValue={setValue}
                    errors={errors}
                    caseIndicator={labelSettings.data?.caseIndicator}
                    indicatorLoading={labelSettings.isPending}
                  />
                </>
              ) : null}
            </Stack>
          </Box>

          <Stack direction={{ base: 'column', md: 'row' }} gap="4" align={{ md: 'center' }}>
            <Button type="submit" size="lg" alignSelf="flex-start" loading={save.isPending} loadingText="Saving…">
              Save recipe
            </Button>
            <Text color="fg.muted">{creating ? 'Saving creates revision 1.' : `Saving creates revision ${base + 1}.`}</Text>
          </Stack>
        </Stack>
      </form>

      <Box hideBelow="xl" position="sticky" top="4" maxH="calc(100dvh - 2rem)" overflowY="auto" minW="0">
        {liveDeclaration}
      </Box>
    </Grid>
  );
}
