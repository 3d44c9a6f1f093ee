import { Box, chakra, SimpleGrid, Stack, Text } from '@chakra-ui/react';
import {
  ALLERGEN_SOURCES,
  EXEMPT_FORM_LABELS,
  EXEMPT_FORMS,
  SOURCE_LABELS,
  sourceOf,
  SPECIES_SOURCES,
  type AllergenSource,
  type ExemptForm,
  type SourceEntry,
} from '@crumbproof/shared';
import { CheckboxInput } from '@/components/ui/choice-inputs';
import { FormField, SelectInput, TextInput } from '@/components/ui/form-field';

const Fieldset = chakra('fieldset');
const Legend = chakra('legend');

const FORM_OPTIONS = [
  { value: '', label: 'Not an exempt form' },
  ...EXEMPT_FORMS.map((form) => ({ value: form, label: EXEMPT_FORM_LABELS[form] })),
];

interface SourcePickerProps {
  /** "Contains" or "May contain": names the group and each detail field. */
  legend: string;
  hint?: string;
  value: readonly SourceEntry[];
  onChange: (entries: SourceEntry[]) => void;
  /** Messages by entry index (from the schema or the API), e.g. a species that is too long. */
  entryErrors?: Record<number, string | undefined>;
  error?: string;
}

function toEntry(source: AllergenSource, form: ExemptForm | undefined, species: string | undefined): SourceEntry {
  const trimmed = species?.trim() === '' ? undefined : species;
  if (!form && trimmed === undefined) return source;
  return { source, ...(form ? { form } : {}), ...(trimmed !== undefined ? { species: trimmed } : {}) };
}

/**
 * A checkbox for every allergen source, and for each one ticked an optional exempt form
 * (glucose syrup from wheat…) and, for fish and shellfish, the species.
 */
export function SourcePicker({ legend, hint, value, onChange, entryErrors = {}, error }: SourcePickerProps) {
  const bySource = new Map(value.map((entry, index) => [sourceOf(entry), { entry, index }]));

  function handleToggle(source: AllergenSource, checked: boolean) {
    if (checked) {
      // Keep the order of ALLERGEN_SOURCES so the saved list reads the same way every time.
      const next = ALLERGEN_SOURCES.filter((s) => s === source || bySource.has(s)).map((s) => bySource.get(s)?.entry ?? s);
      onChange(next);
    } else {
      onChange(value.filter((entry) => sourceOf(entry) !== source));
    }
  }

  function handleDetail(source: AllergenSource, change: { form?: ExemptForm | ''; species?: string }) {
    onChange(
      value.map((entry) => {
        if (sourceOf(entry) !== source) return entry;
        const current = typeof entry === 'string' ? { source: entry } : entry;
        const form = change.form !== undefined ? change.form || undefined : current.form;
        const species = change.species !== undefined ? change.species : current.species;
        return toEntry(source, form, species);
      }),
    );
  }

  const chosen = value.map(sourceOf);

  return (
    <Fieldset borderWidth="1px" borderColor={error ? 'border.error' : 'border.muted'} rounded="md" p="3" minW="0">
      <Legend fontWeight="bold" px="1">
        {legend}
      </Legend>
      {hint ? (
        <Text color="fg.muted" textStyle="sm" mb="2">
          {hint}
        </Text>
      ) : null}
      {error ? (
        <Text color="fg.error" fontWeight="bold" textStyle="sm" mb="2" role="alert">
          {error}
        </Text>
      ) : null}
      <SimpleGrid columns={{ base: 2, sm: 3, md: 4 }} columnGap="3" rowGap="0">
        {ALLERGEN_SOURCES.map((source) => (
          <CheckboxInput
            key={source}
            label={SOURCE_LABELS[source]}
            checked={bySource.has(source)}
            onChange={(event) => handleToggle(source, event.currentTarget.checked)}
          />
        ))}
      </SimpleGrid>
      {chosen.length > 0 ? (
        <Stack gap="3" mt="3" pt="3" borderTopWidth="1px" borderColor="border.subtle">
          <Text textStyle="sm" color="fg.muted">
            Details (optional): an exempt form the supplier names, and the species of fish or shellfish.
          </Text>
          {chosen.map((source) => {
            const found = bySource.get(source);
            const entry = found?.entry;
            const details = typeof entry === 'object' ? entry : { source, form: undefined, species: undefined };
            const label = SOURCE_LABELS[source];
            return (
              <Box key={source}>
                <SimpleGrid columns={{ base: 1, md: SPECIES_SOURCES.includes(source) ? 2 : 1 }} gap="3">
                  <FormField label={`${legend} ${label}: exempt form`} error={found ? entryErrors[found.index] : undefined}>
                    <SelectInput
                      options={FORM_OPTIONS}
                      value={details.form ?? ''}
                      onChange={(event) => handleDetail(source, { form: event.currentTarget.value as ExemptForm | '' })}
                    />
                  </FormField>
                  {SPECIES_SOURCES.includes(source) ? (
                    <FormField label={`${legend} ${label}: species`} hint="For example cod, or shrimp.">
                      <TextInput
                        size="md"
                        value={details.species ?? ''}
                        maxLength={60}
                        onChange={(event) => handleDetail(source, { species: event.currentTarget.value })}
                      />
                    </FormField>
                  ) : null}
                </SimpleGrid>
              </Box>
            );
          })}
        </Stack>
      ) : null}
    </Fieldset>
  );
}
