import { Box, Button, HStack, SimpleGrid, Stack, Text } from '@chakra-ui/react';
import {
  ALLERGEN_SOURCES,
  CONTROL_LABELS,
  CONTROLS,
  kitchenUpdateSchema,
  REGIME_LABELS,
  REGIMES,
  SOURCE_LABELS,
  type KitchenUpdate,
  type KitchenView,
} from '@crumbproof/shared';
import { useState } from 'react';
import { useFieldArray, useForm } from 'react-hook-form';
import { ErrorAlert } from '@/components/ui/error-alert';
import { SaveBar } from '@/components/ui/save-bar';
import { FormField, SelectInput, TextInput } from '@/components/ui/form-field';
import { placeFieldErrors } from '@/lib/place-field-errors';
import { useUpdateKitchen } from '../api/update-kitchen';

const REGIME_OPTIONS = REGIMES.map((r) => ({ value: r, label: `${REGIME_LABELS[r]} (${r})` }));
const MEASURE_OPTIONS = [
  { value: '', label: 'The regime’s usual measures' },
  { value: 'metric', label: 'Metric (tsp 5 ml, tbsp 15 ml, cup 250 ml)' },
  { value: 'us-customary', label: 'US customary (cup 236.6 ml)' },
  { value: 'australian', label: 'Australian (tbsp 20 ml, cup 250 ml)' },
];
const SOURCE_OPTIONS = ALLERGEN_SOURCES.map((s) => ({ value: s, label: SOURCE_LABELS[s] }));
const CONTROL_OPTIONS = CONTROLS.map((c) => ({ value: c, label: CONTROL_LABELS[c] }));

const MARKED = 'Nothing was saved. Check the fields marked above.';

/** The fields a message can be placed beside; a path below one (handles.0.controls) goes on it. */
const FIELDS = ['name', 'address', 'regime', 'measures', 'handles'] as const;
type Field = (typeof FIELDS)[number];
const fieldOf = (path: string): Field | undefined => FIELDS.find((f) => path === f || path.startsWith(`${f}.`));

type FormValues = Required<Pick<KitchenUpdate, 'name' | 'address' | 'regime' | 'handles'>> & { measures: string };

interface KitchenFormProps {
  kitchen: KitchenView;
}

/** The manager's settings: what law the kitchen declares under, and how it handles each allergen. */
export function KitchenForm({ kitchen }: KitchenFormProps) {
  const update = useUpdateKitchen();
  const [saved, setSaved] = useState<string | null>(null);
  const { register, control, handleSubmit, formState, setError, clearErrors } = useForm<FormValues>({
    defaultValues: {
      name: kitchen.name,
      address: kitchen.address,
      regime: kitchen.regime,
      measures: kitchen.measures ?? '',
      handles: kitchen.handles,
    },
  });
  const handles = useFieldArray({ control, name: 'handles' });
  const [problem, setProblem] = useState<string | null>(null);

  function handleSave(values: FormValues) {
    setSaved(null);
    setProblem(null);
    clearErrors();
    const body = { ...values, measures: values.measures === '' ? null : values.measures };
    const parsed = kitchenUpdateSchema.safeParse(body);
    if (!parsed.success) {
      // Each message goes beside the field it is about; one about the form as a whole goes above the button.
      const loose: string[] = [];
      for (const issue of parsed.error.issues) {
        const field = fieldOf(issue.path.map(String).join('.'));
        if (field) setError(field, { message: issue.message });
        else loose.push(issue.message);
      }
      setProblem(loose.length > 0 ? loose.join(' ') : MARKED);
      return;
    }
    update.mutate(parsed.data, {
      onSuccess: () => setSaved('Saved. Every product’s declaration now follows these settings.'),
      onError: (error) =>
        setProblem(
          placeFieldErrors(
            error,
            FIELDS,
            (field, e) => setError(field, e),
            'The settings could not be saved. Check the connection and try again.',
          ) ?? MARKED,
        ),
    });
  }

  const unused = (index: number) => {
    const taken = new Set(handles.fields.map((f, i) => (i === index ? null : f.allergen)));
    return SOURCE_OPTIONS.filter((o) => !taken.has(o.value));
  };

  return (
    <form aria-label="Kitchen settings" noValidate onSubmit={handleSubmit(handleSave)}>
      <Stack gap="6" maxW="4xl">
        <SimpleGrid columns={{ base: 1, md: 2 }} gap="4">
          <FormField label="Kitchen name" error={formState.errors.name?.message}>
            <TextInput {...register('name')} />
          </FormField>
          <FormField label="Address" error={formState.errors.address?.message}>
            <TextInput {...register('address')} />
          </FormField>
          <FormField
            label="Declaring regime"
            error={formState.errors.regime?.message}
            hint="The allergen list, thresholds and statement form the declarations follow."
          >
            <SelectInput options={REGIME_OPTIONS} {...register('regime')} />
          </FormField>
          <FormField
            label="Household measures"
            error={formState.errors.measures?.message}
            hint="How tsp, tbsp and cup in recipes are turned into millilitres."
          >
            <SelectInput options={MEASURE_OPTIONS} {...register('measures')} />
          </FormField>
        </SimpleGrid>

        <Box as="fieldset" borderWidth="1px" borderColor="border.muted" rounded="md" p="4" bg="bg.panel">
          <Box as="legend" px="1" fontWeight="bold">
            Allergen handling in this kitchen
          </Box>
          <Text color="fg.muted" textStyle="sm" mb="3">
            A source kept apart adds nothing. One on shared equipment or in a shared area adds “May contain” to every product that does not
            contain it. Follow your own food-safety system’s assessment.
          </Text>
          <Stack as="ul" listStyleType="none" m="0" p="0" gap="3">
            {handles.fields.map((field, index) => (
              <HStack as="li" key={field.id} gap="3" align="flex-end" wrap="wrap">
                <Box minW="12rem">
                  <FormField label={`Allergen source ${index + 1}`}>
                    <SelectInput options={unused(index)} {...register(`handles.${index}.allergen`)} />
                  </FormField>
                </Box>
                <Box minW="16rem">
                  <FormField label={`How source ${index + 1} is handled`}>
                    <SelectInput options={CONTROL_OPTIONS} {...register(`handles.${index}.controls`)} />
                  </FormField>
                </Box>
                <Button
                  variant="outline"
                  size="lg"
                  onClick={() => handles.remove(index)}
                  aria-label={`Remove allergen source ${index + 1}`}
                >
                  Remove
                </Button>
              </HStack>
            ))}
          </Stack>
          {handles.fields.length === 0 ? <Text>No allergen source is recorded as handled here.</Text> : null}
          {formState.errors.handles?.message ? (
            <Text role="alert" color="fg.error" mt="2">
              {formState.errors.handles.message}
            </Text>
          ) : null}
          <Button
            mt="3"
            variant="outline"
            size="lg"
            onClick={() => {
              const free = unused(-1)[0];
              if (free) handles.append({ allergen: free.value, controls: 'shared-equipment' });
            }}
          >
            Add an allergen source
          </Button>
        </Box>

        {problem ? <ErrorAlert title="Not saved">{problem}</ErrorAlert> : null}
        <SaveBar label="Save kitchen settings" pending={update.isPending} status={saved} />
      </Stack>
    </form>
  );
}
