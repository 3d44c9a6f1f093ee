import { Box, Button, Heading, SimpleGrid, Stack, Text, Textarea } from '@chakra-ui/react';
import { hasEdits, useUnsavedChanges } from '@/lib/unsaved-changes';
import {
  bookIngredientSchema,
  FIGURE_KEYS,
  type BookIngredient,
  type IngredientView,
  type NutrientReferenceRow,
  type SourceEntry,
  type StaleBase,
} from '@crumbproof/shared';
import { zodResolver } from '@hookform/resolvers/zod';
import { useRef, useState, type ReactNode } from 'react';
import { Controller, useForm, useWatch, type FieldErrors, type Path } from 'react-hook-form';
import { ErrorAlert } from '@/components/ui/error-alert';
import { FormField, TextInput } from '@/components/ui/form-field';
import { StaleSavePanel } from '@/components/ui/stale-save-panel';
import { isApiError } from '@/lib/api-client';
import { allergenStatementOf, type AllergenStatement } from '../utils/ingredient-facts';
import {
  extraFigures,
  NUTRITION_FIELDS,
  parseNumberInput,
  parseOptionalText,
  slugify,
  toPayload,
  type IngredientFormValues,
} from '../utils/form-values';
import { ChoiceGroup } from './choice-group';
import { CompositionScanPanel } from './composition-scan-panel';
import { ReferencePicker } from './reference-picker';
import { SourcePicker } from './source-picker';

const STATEMENT_OPTIONS: { value: AllergenStatement; label: string; hint: string }[] = [
  { value: 'stated', label: 'Supplier states these allergens', hint: 'Tick each source the supplier lists.' },
  { value: 'none', label: 'Supplier states no allergens', hint: 'The supplier has confirmed there are none.' },
  { value: 'unknown', label: 'No allergen statement yet', hint: 'Shown as “Not known” until the supplier answers.' },
];

type Diet = 'yes' | 'no' | 'unknown';
const DIET_OPTIONS: { value: Diet; label: string }[] = [
  { value: 'yes', label: 'Yes' },
  { value: 'no', label: 'No' },
  { value: 'unknown', label: 'Not known' },
];
const toDiet = (value: boolean | null | undefined): Diet => (value === true ? 'yes' : value === false ? 'no' : 'unknown');
const fromDiet = (value: Diet): boolean | null => (value === 'yes' ? true : value === 'no' ? false : null);

/** Paths the form shows a control for: an API message on one of them goes in place. */
const PLACEABLE = new Set<string>([
  'id',
  'name',
  'supplier',
  'supplierCode',
  'composition',
  'vegan',
  'vegetarian',
  'sulphiteMgPerKg',
  'gPerMl',
  'gEach',
  'addsSugars',
  'contains',
  'mayContain',
  'nutrition.source',
  ...NUTRITION_FIELDS.map((field) => `nutrition.${field.key}`),
]);

function placeFor(path: string): string | undefined {
  if (PLACEABLE.has(path)) return path;
  const top = path.split('.')[0] ?? '';
  if (top === 'contains' || top === 'mayContain') return top;
  return undefined;
}

/** The first message anywhere in a nested error (an entry of contains, say). */
function firstMessage(error: unknown): string | undefined {
  if (!error || typeof error !== 'object') return undefined;
  const record = error as Record<string, unknown>;
  if (typeof record.message === 'string' && record.message !== '') return record.message;
  for (const [key, value] of Object.entries(record)) {
    if (key === 'ref' || key === 'type') continue;
    const found = firstMessage(value);
    if (found) return found;
  }
  return undefined;
}

function errorAt(errors: FieldErrors<IngredientFormValues>, path: string): string | undefined {
  let node: unknown = errors;
  for (const part of path.split('.')) node = (node as Record<string, unknown> | undefined)?.[part];
  return firstMessage(node);
}

function toFormValues(ingredient: IngredientView | BookIngredient | undefined): IngredientFormValues {
  if (!ingredient) {
    return {
      id: '',
      name: '',
      supplier: '',
      supplierCode: '',
      contains: undefined,
      mayContain: [],
      composition: '',
      vegan: null,
      vegetarian: null,
      nutrition: {},
    };
  }
  const { revision: _revision, updatedAt: _updatedAt, ...body } = ingredient as IngredientView;
  return { ...body, mayContain: body.mayContain ?? [], nutrition: body.nutrition ?? {} };
}

function Section({ title, children }: { title: string; children: ReactNode }) {
  return (
    <Box as="section" borderTopWidth="1px" borderColor="border.muted" pt="4">
      <Heading as="h2" size="md" mb="3">
        {title}
      </Heading>
      <Stack gap="4">{children}</Stack>
    </Box>
  );
}

interface IngredientFormProps {
  /** The ingredient being edited; none for a new one. */
  ingredient?: IngredientView;
  /** `baseRevision` is the revision the form shows (none for a new ingredient). */
  onSave: (ingredient: BookIngredient, baseRevision: number | undefined) => Promise<IngredientView>;
  saving: boolean;
  onSaved: (saved: IngredientView) => void;
}

export function IngredientForm({ ingredient, onSave, saving, onSaved }: IngredientFormProps) {
  const isNew = ingredient === undefined;
  const [statement, setStatement] = useState<AllergenStatement>(ingredient ? allergenStatementOf(ingredient) : 'unknown');
  const [formError, setFormError] = useState<{ title: string; messages: string[] } | null>(null);
  const [saved, setSaved] = useState<string | null>(null);
  const [filledFrom, setFilledFrom] = useState<string | null>(null);
  // The revision the form was loaded from; a save names it, and moves it on only by a save or a reload.
  const [base, setBase] = useState(ingredient?.revision);
  const [stale, setStale] = useState<StaleBase | null>(null);
  // Sources ticked before switching to "no allergens" or "no statement", restored on switching back.
  const rememberedContains = useRef<SourceEntry[]>(ingredient?.contains ?? []);
  const rememberedMayContain = useRef<SourceEntry[]>(ingredient?.mayContain ?? []);

  const {
    register,
    control,
    handleSubmit,
    setValue,
    setError,
    clearErrors,
    getFieldState,
    getValues,
    reset,
    formState: { errors, dirtyFields },
  } = useForm<IngredientFormValues, unknown, BookIngredient>({
    resolver: zodResolver(bookIngredientSchema),
    defaultValues: toFormValues(ingredient),
  });

  const guard = useUnsavedChanges(hasEdits(dirtyFields));
  const composition = useWatch({ control, name: 'composition' }) ?? '';
  const contains = useWatch({ control, name: 'contains' });
  const nutrition = useWatch({ control, name: 'nutrition' });
  const extras = extraFigures(nutrition);

  function handleStatement(next: AllergenStatement) {
    const current = getValues('contains');
    if (current && current.length > 0) rememberedContains.current = current;
    const may = getValues('mayContain');
    if (may && may.length > 0) rememberedMayContain.current = may;
    setStatement(next);
    clearErrors('contains');
    if (next === 'stated') setValue('contains', rememberedContains.current, { shouldDirty: true });
    if (next === 'none') setValue('contains', [], { shouldDirty: true });
    if (next === 'unknown') setValue('contains', undefined, { shouldDirty: true });
    setValue('mayContain', next === 'unknown' ? [] : rememberedMayContain.current, { shouldDirty: true });
  }

  function handleReference(row: NutrientReferenceRow) {
    for (const key of FIGURE_KEYS) {
      setValue(`nutrition.${key}`, row.nutrition[key], { shouldDirty: true, shouldValidate: false });
    }
    setValue('nutrition.source', row.nutrition.source, { shouldDirty: true });
    if (row.addsSugars !== undefined) setValue('addsSugars', row.addsSugars, { shouldDirty: true });
    clearErrors('nutrition');
    setFilledFrom(row.name);
  }

  async function handleSave(values: BookIngredient, baseRevision = base) {
    setFormError(null);
    setSaved(null);
    setStale(null);
    if (statement === 'stated' && (values.contains ?? []).length === 0) {
      setError('contains', { message: 'Tick at least one allergen source, or choose “Supplier states no allergens”.' });
      return;
    }
    const payload = toPayload({
      ...values,
      contains: statement === 'unknown' ? undefined : statement === 'none' ? [] : values.contains,
      mayContain: statement === 'unknown' ? [] : values.mayContain,
    });
    try {
      const result = await onSave(payload, baseRevision);
      setBase(result.revision);
      guard.release();
      reset(toFormValues(result));
      setStatement(allergenStatementOf(result));
      setSaved(isNew ? `${result.name} was added.` : `Saved. This is revision ${result.revision}.`);
      onSaved(result);
    } catch (error) {
      if (!isApiError(error)) {
        setFormError({ title: 'The ingredient was not saved', messages: ['Try again in a moment.'] });
        return;
      }
      if (error.code === 'stale-base' && error.stale) {
        setStale(error.stale);
        return;
      }
      if (error.code === 'conflict') {
        setError('id', { message: error.message });
        setFormError({ title: 'The ingredient was not saved', messages: [error.message] });
        return;
      }
      const unplaced: string[] = [];
      for (const field of error.fields) {
        const place = placeFor(field.path);
        if (place) setError(place as Path<IngredientFormValues>, { message: field.message });
        else unplaced.push(`${field.path}: ${field.message}`);
      }
      setFormError({ title: 'The ingredient was not saved', messages: [error.message, ...unplaced] });
    }
  }

  /** Their version in the form, as the base of the next save; what was typed is dropped (the panel said so). */
  function reloadTheirs(theirs: StaleBase) {
    const current = theirs.current as BookIngredient;
    setBase(theirs.currentRevision);
    rememberedContains.current = current.contains ?? [];
    rememberedMayContain.current = current.mayContain ?? [];
    reset(toFormValues(current));
    setStatement(allergenStatementOf(current));
    setStale(null);
    setSaved(`Showing revision ${theirs.currentRevision}, as ${theirs.saves.at(-1)?.authorName ?? 'they'} saved it.`);
  }

  /** The values in the form saved again, on top of their revision. */
  function saveMineOver(theirs: StaleBase) {
    setBase(theirs.currentRevision);
    void handleSubmit((values) => handleSave(values, theirs.currentRevision))();
  }

  const nameField = register('name', {
    onChange: (event: { target: { value: string } }) => {
      if (isNew && !getFieldState('id').isDirty) setValue('id', slugify(event.target.value));
    },
  });

  return (
    <form
      aria-label={isNew ? 'New ingredient' : `Edit ${ingredient.name}`}
      noValidate
      onSubmit={handleSubmit((values) => handleSave(values))}
    >
      <Stack gap="5">
        {stale ? (
          <StaleSavePanel stale={stale} saving={saving} onReload={() => reloadTheirs(stale)} onSaveMine={() => saveMineOver(stale)} />
        ) : null}
        {formError ? (
          <ErrorAlert title={formError.title}>
            {formError.messages.map((message, index) => (
              <Text key={index}>{message}</Text>
            ))}
          </ErrorAlert>
        ) : null}

        <SimpleGrid columns={{ base: 1, md: 2 }} gap="4">
          <FormField label="Name" error={errorAt(errors, 'name')} required>
            <TextInput autoComplete="off" {...nameField} />
          </FormField>
          {isNew ? (
            <FormField
              label="Ingredient id"
              hint="Used in recipe lines; it cannot be changed later."
              error={errorAt(errors, 'id')}
              required
            >
              <TextInput autoComplete="off" spellCheck={false} {...register('id')} />
            </FormField>
          ) : null}
          <FormField label="Supplier" error={errorAt(errors, 'supplier')}>
            <TextInput autoComplete="off" {...register('supplier', { setValueAs: parseOptionalText })} />
          </FormField>
          <FormField label="Supplier code" error={errorAt(errors, 'supplierCode')}>
            <TextInput autoComplete="off" {...register('supplierCode', { setValueAs: parseOptionalText })} />
          </FormField>
        </SimpleGrid>

        <Section title="Allergens">
          <ChoiceGroup
            legend="Allergen statement"
            name="allergen-statement"
            direction="column"
            options={STATEMENT_OPTIONS}
            value={statement}
            onChange={handleStatement}
          />
          {statement === 'stated' ? (
            <Controller
              control={control}
              name="contains"
              render={({ field }) => (
                <SourcePicker
                  legend="Contains"
                  hint="What the supplier’s specification lists as present."
                  value={field.value ?? []}
                  onChange={(entries) => {
                    field.onChange(entries);
                    if (entries.length > 0) clearErrors('contains');
                  }}
                  error={errorAt(errors, 'contains')}
                />
              )}
            />
          ) : null}
          {statement !== 'unknown' ? (
            <Controller
              control={control}
              name="mayContain"
              render={({ field }) => (
                <SourcePicker
                  legend="May contain"
                  hint="Precautionary: what the supplier says may be present through cross-contact."
                  value={field.value ?? []}
                  onChange={field.onChange}
                  error={errorAt(errors, 'mayContain')}
                />
              )}
            />
          ) : null}
        </Section>

        <Section title="Composition">
          <FormField
            label="Composition (supplier's ingredients text)"
            hint="Paste it as written. Crumbproof marks the terms it recognises and compares them with the allergen statement."
            error={errorAt(errors, 'composition')}
          >
            <Textarea rows={4} bg="bg.panel" borderColor="border" {...register('composition', { setValueAs: parseOptionalText })} />
          </FormField>
          <CompositionScanPanel text={composition} contains={statement === 'unknown' ? undefined : (contains ?? [])} />
        </Section>

        <Section title="Dietary status">
          <SimpleGrid columns={{ base: 1, md: 2 }} gap="4">
            <Controller
              control={control}
              name="vegan"
              render={({ field }) => (
                <ChoiceGroup
                  legend="Vegan"
                  name="vegan"
                  options={DIET_OPTIONS}
                  value={toDiet(field.value)}
                  onChange={(value) => field.onChange(fromDiet(value))}
                  error={errorAt(errors, 'vegan')}
                />
              )}
            />
            <Controller
              control={control}
              name="vegetarian"
              render={({ field }) => (
                <ChoiceGroup
                  legend="Vegetarian"
                  name="vegetarian"
                  options={DIET_OPTIONS}
                  value={toDiet(field.value)}
                  onChange={(value) => field.onChange(fromDiet(value))}
                  error={errorAt(errors, 'vegetarian')}
                />
              )}
            />
          </SimpleGrid>
        </Section>

        <Section title="Measures">
          <SimpleGrid columns={{ base: 1, md: 3 }} gap="4">
            <FormField label="Sulphites (mg/kg as SO2)" error={errorAt(errors, 'sulphiteMgPerKg')}>
              <TextInput inputMode="decimal" {...register('sulphiteMgPerKg', { setValueAs: parseNumberInput })} />
            </FormField>
            <FormField
              label="Weight per millilitre (g)"
              hint="Needed when a recipe uses it in ml, l or spoons."
              error={errorAt(errors, 'gPerMl')}
            >
              <TextInput inputMode="decimal" {...register('gPerMl', { setValueAs: parseNumberInput })} />
            </FormField>
            <FormField label="Weight of one unit (g)" hint="Needed when a recipe counts it (each)." error={errorAt(errors, 'gEach')}>
              <TextInput inputMode="decimal" {...register('gEach', { setValueAs: parseNumberInput })} />
            </FormField>
          </SimpleGrid>
        </Section>

        <Section title="Nutrition per 100 g">
          <Text color="fg.muted" textStyle="sm">
            In grams per 100 g as bought. A box left empty is not known; it is never read as zero.
          </Text>
          <ReferencePicker onPick={handleReference} />
          <Text role="status" color="fg.muted" textStyle="sm">
            {filledFrom ? `Filled from the reference table: ${filledFrom}. Figures from: ${nutrition?.source ?? ''}` : null}
          </Text>
          <SimpleGrid columns={{ base: 2, md: 4 }} gap="4">
            {NUTRITION_FIELDS.map((field) => (
              <FormField key={field.key} label={field.label} error={errorAt(errors, `nutrition.${field.key}`)}>
                <TextInput
                  inputMode="decimal"
                  textStyle="quantity"
                  {...register(`nutrition.${field.key}`, { setValueAs: parseNumberInput })}
                />
              </FormField>
            ))}
          </SimpleGrid>
          {extras.length > 0 ? (
            <Text textStyle="sm" color="fg.muted">
              Also kept with these figures: {extras.join(', ')}.
              {typeof nutrition?.sodium === 'number' && typeof nutrition?.salt !== 'number'
                ? ' Salt is worked out from sodium (× 2.5).'
                : ''}
            </Text>
          ) : null}
          <Controller
            control={control}
            name="addsSugars"
            render={({ field }) => (
              <ChoiceGroup
                legend="Its sugars count as added sugars (US labels)"
                name="addsSugars"
                options={DIET_OPTIONS}
                value={toDiet(field.value)}
                onChange={(value) => field.onChange(fromDiet(value) ?? undefined)}
                error={errorAt(errors, 'addsSugars')}
              />
            )}
          />
          <FormField
            label="Figures from"
            hint="Where these figures come from: a supplier specification, or a reference table row."
            error={errorAt(errors, 'nutrition.source')}
          >
            <TextInput autoComplete="off" {...register('nutrition.source', { setValueAs: parseOptionalText })} />
          </FormField>
        </Section>

        <Stack direction={{ base: 'column', md: 'row' }} gap="4" align={{ md: 'center' }}>
          <Button type="submit" size="lg" alignSelf="flex-start" loading={saving} loadingText="Saving…">
            Save ingredient
          </Button>
          <Text role="status" color="fg.muted">
            {saved}
          </Text>
        </Stack>
      </Stack>
    </form>
  );
}
