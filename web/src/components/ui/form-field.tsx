import { Field, Input, NativeSelect, type InputProps } from '@chakra-ui/react';
import { forwardRef, type ReactNode } from 'react';

interface FormFieldProps {
  label: string;
  /** The message from the form's resolver or from the API, shown under the control. */
  error?: string;
  hint?: ReactNode;
  required?: boolean;
  children: ReactNode;
}

/** Label, control, hint and error wired together (ids, aria-describedby, aria-invalid). */
export function FormField({ label, error, hint, required, children }: FormFieldProps) {
  return (
    <Field.Root invalid={Boolean(error)} required={required}>
      <Field.Label fontWeight="bold" color="fg" textStyle="md">
        {label}
      </Field.Label>
      {children}
      {hint ? (
        <Field.HelperText color="fg.muted" textStyle="sm">
          {hint}
        </Field.HelperText>
      ) : null}
      {error ? (
        <Field.ErrorText color="fg.error" textStyle="sm" fontWeight="bold">
          {error}
        </Field.ErrorText>
      ) : null}
    </Field.Root>
  );
}

/** A text input sized for touch (44 px) and styled with our tokens. */
export const TextInput = forwardRef<HTMLInputElement, InputProps>(function TextInput(props, ref) {
  return <Input ref={ref} size="lg" bg="bg.panel" borderColor="border" {...props} />;
});

interface SelectInputProps extends React.ComponentProps<typeof NativeSelect.Field> {
  options: readonly { value: string; label: string }[];
  disabled?: boolean;
}

/**
 * A native select: the most dependable choice for keyboards, touch and screen readers. A width
 * (`w`) sizes the whole control, so its indicator stays inside the box however wide the space is.
 */
export const SelectInput = forwardRef<HTMLSelectElement, SelectInputProps>(function SelectInput({ options, disabled, w, ...props }, ref) {
  return (
    <NativeSelect.Root size="lg" disabled={disabled} w={w}>
      <NativeSelect.Field ref={ref} bg="bg.panel" borderColor="border" {...props}>
        {options.map((option) => (
          <option key={option.value} value={option.value}>
            {option.label}
          </option>
        ))}
      </NativeSelect.Field>
      <NativeSelect.Indicator color="fg.muted" />
    </NativeSelect.Root>
  );
});
