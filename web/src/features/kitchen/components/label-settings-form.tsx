import { Box, Code, HStack, SimpleGrid, Stack, Text } from '@chakra-ui/react';
import { BATCH_TOKENS, batchPatternProblem, expandBatchPattern, labelSettingsSchema, type LabelSettings } from '@crumbproof/shared';
import { useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { ErrorAlert } from '@/components/ui/error-alert';
import { SaveBar } from '@/components/ui/save-bar';
import { FormField, SelectInput, TextInput } from '@/components/ui/form-field';
import { isApiError } from '@/lib/api-client';
import { useUpdateLabelSettings } from '../api/update-label-settings';

interface FormValues {
  batchPattern: string;
  gs1CompanyPrefix: string;
  ssccExtension: string;
  caseIndicator: string;
}

type Field = keyof FormValues;

const EXTENSION_OPTIONS = Array.from({ length: 10 }, (_, n) => ({ value: String(n), label: String(n) }));
const INDICATOR_OPTIONS = Array.from({ length: 8 }, (_, n) => ({ value: String(n + 1), label: String(n + 1) }));

/** The example a pattern is shown with: today, a product with a long id, its first run of the day. */
function example(pattern: string): string {
  const today = new Date().toISOString().slice(0, 10);
  return expandBatchPattern(pattern, { date: today, product: 'lemon-tart', sequence: 1 });
}

function toBody(values: FormValues) {
  const prefix = values.gs1CompanyPrefix.trim();
  return {
    batchPattern: values.batchPattern.trim(),
    gs1CompanyPrefix: prefix === '' ? null : prefix,
    ssccExtension: Number(values.ssccExtension),
    caseIndicator: Number(values.caseIndicator),
  };
}

/** The manager's label settings: how batch codes are made, and the kitchen's GS1 numbers. */
export function LabelSettingsForm({ settings }: { settings: LabelSettings }) {
  const update = useUpdateLabelSettings();
  const [saved, setSaved] = useState<string | null>(null);
  const { register, control, handleSubmit, setError, clearErrors, formState } = useForm<FormValues>({
    defaultValues: {
      batchPattern: settings.batchPattern,
      gs1CompanyPrefix: settings.gs1CompanyPrefix ?? '',
      ssccExtension: String(settings.ssccExtension),
      caseIndicator: String(settings.caseIndicator),
    },
  });
  const pattern = useWatch({ control, name: 'batchPattern' }) ?? '';
  const patternProblem = pattern.trim() === '' ? null : batchPatternProblem(pattern.trim());

  function handleSave(values: FormValues) {
    setSaved(null);
    clearErrors();
    const parsed = labelSettingsSchema.safeParse(toBody(values));
    if (!parsed.success) {
      for (const issue of parsed.error.issues) setError(String(issue.path[0]) as Field, { message: issue.message });
      return;
    }
    update.mutate(parsed.data, {
      onSuccess: () => setSaved('Saved. Labels printed from now on follow these settings.'),
      onError: (error) => {
        if (!isApiError(error)) return;
        for (const field of error.fields) {
          const name = field.path.split('.')[0] as Field;
          if (name in values) setError(name, { message: field.message });
        }
      },
    });
  }

  const errors = formState.errors;
  return (
    <form aria-label="Label settings" noValidate onSubmit={handleSubmit(handleSave)}>
      <Stack gap="5" maxW="4xl">
        <FormField
          label="Batch code pattern"
          error={errors.batchPattern?.message ?? patternProblem ?? undefined}
          hint={
            patternProblem ? undefined : (
              <>
                A run made today of a product with the id lemon-tart gets <Code>{example(pattern.trim())}</Code>. Codes are unique per
                product and day.
              </>
            )
          }
        >
          <TextInput autoComplete="off" spellCheck={false} textStyle="quantity" {...register('batchPattern')} />
        </FormField>
        <Box as="details" color="fg.muted" textStyle="sm">
          <Box as="summary" cursor="pointer" color="fg">
            What each part of the pattern becomes
          </Box>
          <Stack as="dl" gap="1" mt="2">
            {Object.entries(BATCH_TOKENS).map(([token, meaning]) => (
              <HStack key={token} gap="2" align="baseline">
                <Text as="dt" fontWeight="bold" minW="4.5rem" color="fg">
                  <Code>{token}</Code>
                </Text>
                <Text as="dd">{meaning}</Text>
              </HStack>
            ))}
          </Stack>
        </Box>
        <SimpleGrid columns={{ base: 1, md: 3 }} gap="4">
          <FormField
            label="GS1 company prefix"
            error={errors.gs1CompanyPrefix?.message}
            hint="6 to 12 digits, from your GS1 membership. Leave it empty while the kitchen has none: shipment labels (SSCC) need it."
          >
            <TextInput inputMode="numeric" autoComplete="off" textStyle="quantity" {...register('gs1CompanyPrefix')} />
          </FormField>
          <FormField
            label="SSCC extension digit"
            error={errors.ssccExtension?.message}
            hint="The first digit of every SSCC this kitchen gives out."
          >
            <SelectInput options={EXTENSION_OPTIONS} {...register('ssccExtension')} />
          </FormField>
          <FormField
            label="Case indicator digit"
            error={errors.caseIndicator?.message}
            hint="The first digit of a case GTIN-14 made from a unit’s GTIN."
          >
            <SelectInput options={INDICATOR_OPTIONS} {...register('caseIndicator')} />
          </FormField>
        </SimpleGrid>

        {update.isError ? (
          <ErrorAlert title="Label settings not saved">
            {update.error.message}
            {isApiError(update.error) && update.error.fields.length > 0 ? ' Each problem is shown beside its field.' : null}
          </ErrorAlert>
        ) : null}
        <SaveBar label="Save label settings" pending={update.isPending} status={saved} />
      </Stack>
    </form>
  );
}
