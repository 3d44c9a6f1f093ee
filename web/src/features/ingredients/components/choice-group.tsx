import { chakra, Stack, Text } from '@chakra-ui/react';
import type { ReactNode } from 'react';
import { RadioInput } from '@/components/ui/choice-inputs';

const Fieldset = chakra('fieldset');
const Legend = chakra('legend');

interface ChoiceGroupProps<T extends string> {
  legend: string;
  /** The form control name shared by the radios (arrow keys move between them). */
  name: string;
  options: readonly { value: T; label: string; hint?: ReactNode }[];
  value: T;
  onChange: (value: T) => void;
  direction?: 'row' | 'column';
  error?: string;
}

/** A radio group as a fieldset: the legend names the group, each label names its radio. */
export function ChoiceGroup<T extends string>({ legend, name, options, value, onChange, direction = 'row', error }: ChoiceGroupProps<T>) {
  return (
    <Fieldset minW="0">
      <Legend fontWeight="bold" mb="1">
        {legend}
      </Legend>
      <Stack
        direction={direction === 'row' ? { base: 'column', sm: 'row' } : 'column'}
        gap={direction === 'row' ? { base: '0', sm: '5' } : '0'}
      >
        {options.map((option) => (
          <RadioInput
            key={option.value}
            name={name}
            value={option.value}
            label={option.label}
            hint={option.hint}
            checked={value === option.value}
            onChange={() => onChange(option.value)}
          />
        ))}
      </Stack>
      {error ? (
        <Text color="fg.error" fontWeight="bold" textStyle="sm">
          {error}
        </Text>
      ) : null}
    </Fieldset>
  );
}
