import { Button, SimpleGrid } from '@chakra-ui/react';
import { ALLERGEN_SOURCES, SOURCE_LABELS, type AllergenSource } from '@crumbproof/shared';
import { FormField, SelectInput, TextInput } from '@/components/ui/form-field';
import { MISSING_DATA, type MissingData } from '../utils/ingredient-facts';
import {
  NO_FILTERS,
  type DietaryFilter,
  type LibraryFilters,
  type MissingFilter,
  type SpecificationFilter,
} from '../utils/library-filters';

const SOURCE_OPTIONS = [
  { value: '', label: 'Any source' },
  ...ALLERGEN_SOURCES.map((source) => ({ value: source, label: SOURCE_LABELS[source] })),
];

const DIETARY_OPTIONS: { value: DietaryFilter; label: string }[] = [
  { value: '', label: 'Any' },
  { value: 'vegan-yes', label: 'Vegan: yes' },
  { value: 'vegan-no', label: 'Vegan: no' },
  { value: 'vegan-unknown', label: 'Vegan: not known' },
  { value: 'vegetarian-yes', label: 'Vegetarian: yes' },
  { value: 'vegetarian-no', label: 'Vegetarian: no' },
  { value: 'vegetarian-unknown', label: 'Vegetarian: not known' },
];

const SPECIFICATION_OPTIONS: { value: SpecificationFilter; label: string }[] = [
  { value: '', label: 'All' },
  { value: 'missing', label: 'Missing' },
  { value: 'overdue', label: 'Review overdue' },
  { value: 'current', label: 'Current' },
];

const MISSING_OPTIONS: { value: MissingFilter; label: string }[] = [
  { value: '', label: 'Show all' },
  { value: 'any', label: 'Anything missing' },
  ...(Object.keys(MISSING_DATA) as MissingData[]).map((key) => ({ value: key, label: MISSING_DATA[key] })),
];

interface LibraryFiltersBarProps {
  filters: LibraryFilters;
  onChange: (filters: LibraryFilters) => void;
  /** False while the specification status is not known: that filter would mislead. */
  specificationsKnown: boolean;
}

export function LibraryFiltersBar({ filters, onChange, specificationsKnown }: LibraryFiltersBarProps) {
  const active = JSON.stringify(filters) !== JSON.stringify(NO_FILTERS);
  return (
    <SimpleGrid as="search" columns={{ base: 1, sm: 2, lg: 5 }} gap="3" alignItems="end">
      <FormField label="Search ingredients">
        <TextInput
          type="search"
          placeholder="Name, supplier or code"
          value={filters.search}
          onChange={(event) => onChange({ ...filters, search: event.currentTarget.value })}
        />
      </FormField>
      <FormField label="Contains allergen source">
        <SelectInput
          options={SOURCE_OPTIONS}
          value={filters.source}
          onChange={(event) => onChange({ ...filters, source: event.currentTarget.value as AllergenSource | '' })}
        />
      </FormField>
      <FormField label="Dietary status">
        <SelectInput
          options={DIETARY_OPTIONS}
          value={filters.dietary}
          onChange={(event) => onChange({ ...filters, dietary: event.currentTarget.value as DietaryFilter })}
        />
      </FormField>
      <FormField label="Specification" hint={specificationsKnown ? undefined : 'Specification status could not be loaded.'}>
        <SelectInput
          // Without the status, offering "Missing" or "Review overdue" would find nothing and mislead.
          options={specificationsKnown ? SPECIFICATION_OPTIONS : SPECIFICATION_OPTIONS.slice(0, 1)}
          value={specificationsKnown ? filters.specification : ''}
          onChange={(event) => onChange({ ...filters, specification: event.currentTarget.value as SpecificationFilter })}
        />
      </FormField>
      <FormField label="Data missing">
        <SelectInput
          options={MISSING_OPTIONS}
          value={filters.missing}
          onChange={(event) => onChange({ ...filters, missing: event.currentTarget.value as MissingFilter })}
        />
      </FormField>
      {active ? (
        <Button variant="ghost" size="sm" alignSelf="start" onClick={() => onChange(NO_FILTERS)}>
          Clear filters
        </Button>
      ) : null}
    </SimpleGrid>
  );
}
