import { Box, Button, SimpleGrid, Stack, Text } from '@chakra-ui/react';
import { caseGtinFromUnit, verifyGs1Key } from '@crumbproof/shared';
import { useState } from 'react';
import { useWatch, type Control, type FieldErrors, type UseFormRegister, type UseFormSetValue } from 'react-hook-form';
import { FormField, SelectInput, TextInput } from '@/components/ui/form-field';
import { numberOrUndefined, type EditorValues } from './editor-values';

const DATE_MARK_OPTIONS = [
  { value: '', label: 'No date on the label' },
  { value: 'best-before', label: 'Best before' },
  { value: 'use-by', label: 'Use by' },
];

const KEY_LENGTHS: Record<'unit-gtin' | 'gtin-14', readonly number[]> = { 'unit-gtin': [8, 12, 13], 'gtin-14': [14] };

/**
 * What the GTIN box says as it is typed: nothing while empty; the digits so far while the number
 * is still short; then whether its check digit holds (GS1 modulo 10).
 */
function keyStatus(value: string, kind: 'unit-gtin' | 'gtin-14'): { problem: string | null; note: string | null } {
  const digits = value.trim();
  if (digits === '') return { problem: null, note: null };
  const lengths = KEY_LENGTHS[kind];
  const longest = Math.max(...lengths);
  if (/^[0-9]+$/.test(digits) && digits.length < longest && !lengths.includes(digits.length))
    return { problem: null, note: `${digits.length} digits so far; a ${kind === 'gtin-14' ? 'GTIN-14 has 14' : 'GTIN has 8, 12 or 13'}.` };
  const problem = verifyGs1Key(digits, kind);
  return problem ? { problem, note: null } : { problem: null, note: `GTIN-${digits.length}: the check digit ${digits.at(-1)} is right.` };
}

interface PrintDetailsFieldsProps {
  register: UseFormRegister<EditorValues>;
  control: Control<EditorValues>;
  setValue: UseFormSetValue<EditorValues>;
  errors: FieldErrors<EditorValues>;
  /** The kitchen's case indicator digit (label settings); undefined while it is not known. */
  caseIndicator: number | undefined;
  /** The label settings are still being read. */
  indicatorLoading: boolean;
}

const numberField = { type: 'number', inputMode: 'decimal', step: 'any', min: '0', textStyle: 'quantity' } as const;
const wholeField = { type: 'number', inputMode: 'numeric', step: '1', min: '1', textStyle: 'quantity' } as const;

/** The product's print details: what its labels print besides the declaration. */
export function PrintDetailsFields({ register, control, setValue, errors, caseIndicator, indicatorLoading }: PrintDetailsFieldsProps) {
  const [gtin = '', caseGtin = ''] = useWatch({ control, name: ['gtin', 'caseGtin'] });
  const unit = keyStatus(gtin, 'unit-gtin');
  const kase = keyStatus(caseGtin, 'gtin-14');
  const [deriveProblem, setDeriveProblem] = useState<string | null>(null);
  const canDerive = gtin.trim() !== '' && verifyGs1Key(gtin.trim(), 'unit-gtin') === null;

  function derive() {
    if (caseIndicator === undefined) return;
    try {
      setValue('caseGtin', caseGtinFromUnit(gtin.trim(), caseIndicator), { shouldDirty: true, shouldValidate: true });
      setDeriveProblem(null);
    } catch (error) {
      setDeriveProblem(error instanceof Error ? error.message : 'The case GTIN could not be made from this GTIN.');
    }
  }

  return (
    <Box as="fieldset" minW="0">
      <Text as="legend" fontWeight="bold">
        Print details
      </Text>
      <Text color="fg.muted" textStyle="sm" mb="3">
        What the product’s labels print besides its declaration. Leave a box empty where the product has none; a label that needs it is then
        refused and says which.
      </Text>
      <Stack gap="4">
        <SimpleGrid columns={{ base: 1, md: 2 }} gap="4">
          <FormField
            label="Date mark"
            error={errors.dateMark?.message}
            hint="Use by for foods that spoil quickly and could then be a danger; best before otherwise."
          >
            <SelectInput options={DATE_MARK_OPTIONS} {...register('dateMark')} />
          </FormField>
          <FormField
            label="Shelf life (days)"
            error={errors.shelfLifeDays?.message}
            hint="From the production date to the date on the label."
          >
            <TextInput {...wholeField} {...register('shelfLifeDays', { setValueAs: numberOrUndefined })} />
          </FormField>
          <Box gridColumn="1 / -1">
            <FormField label="Storage" error={errors.storage?.message} hint="One line, e.g. Keep refrigerated at 0–5 °C.">
              <TextInput autoComplete="off" {...register('storage')} />
            </FormField>
          </Box>
          <FormField label="Net weight (g)" error={errors.netWeightG?.message} hint="Of one unit, as the label states it.">
            <TextInput {...numberField} {...register('netWeightG', { setValueAs: numberOrUndefined })} />
          </FormField>
          <FormField label="Units per case" error={errors.unitsPerCase?.message} hint="How many units a wholesale case holds.">
            <TextInput {...wholeField} {...register('unitsPerCase', { setValueAs: numberOrUndefined })} />
          </FormField>
          <FormField
            label="GTIN of one unit"
            error={errors.gtin?.message ?? unit.problem ?? undefined}
            hint={unit.note ?? 'GTIN-8, -12 (UPC-A) or -13 (EAN-13), for the barcode on the product label.'}
          >
            <TextInput inputMode="numeric" autoComplete="off" spellCheck={false} textStyle="quantity" {...register('gtin')} />
          </FormField>
        </SimpleGrid>
        <Stack direction={{ base: 'column', md: 'row' }} gap="4" align={{ md: 'flex-start' }}>
          <Box flex="1" minW="0">
            <FormField
              label="Case GTIN-14"
              error={errors.caseGtin?.message ?? kase.problem ?? deriveProblem ?? undefined}
              hint={kase.note ?? 'For the GS1-128 barcode on case labels.'}
            >
              <TextInput inputMode="numeric" autoComplete="off" spellCheck={false} textStyle="quantity" {...register('caseGtin')} />
            </FormField>
          </Box>
          <Stack gap="1" pt={{ md: '7' }} maxW={{ md: '18rem' }}>
            <Button variant="outline" size="lg" onClick={derive} disabled={!canDerive || caseIndicator === undefined}>
              Derive from the unit GTIN
            </Button>
            <Text color="fg.muted" textStyle="sm">
              {caseIndicator === undefined
                ? indicatorLoading
                  ? 'Reading the kitchen’s case indicator digit…'
                  : 'The kitchen’s case indicator digit could not be read, so no case GTIN can be derived.'
                : `With the kitchen’s case indicator digit ${caseIndicator} (set on the Kitchen page).`}
            </Text>
          </Stack>
        </Stack>
      </Stack>
    </Box>
  );
}
