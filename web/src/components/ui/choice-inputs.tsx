import { chakra, HStack, Text } from '@chakra-ui/react';
import { forwardRef, type InputHTMLAttributes, type ReactNode } from 'react';

const NativeInput = chakra('input');

const focusRing = { outline: '2px solid', outlineColor: 'accent.focusRing', outlineOffset: '2px' } as const;

interface ChoiceProps extends Omit<InputHTMLAttributes<HTMLInputElement>, 'type' | 'size' | 'children'> {
  /** The visible label; it names the control. */
  label: ReactNode;
  /** Extra words under the label, read as the control's description. */
  hint?: ReactNode;
}

function ChoiceLabel({ label, hint }: Pick<ChoiceProps, 'label' | 'hint'>) {
  return (
    <Text as="span" display="flex" flexDirection="column" lineHeight="1.3">
      <span>{label}</span>
      {hint ? (
        <Text as="span" color="fg.muted" textStyle="sm">
          {hint}
        </Text>
      ) : null}
    </Text>
  );
}

/**
 * Native checkbox and radio inputs, labelled by their wrapping <label>: the most dependable
 * choice for keyboards, touch and screen readers. At least 44 px tall to touch.
 */
export const CheckboxInput = forwardRef<HTMLInputElement, ChoiceProps>(function CheckboxInput({ label, hint, ...props }, ref) {
  return (
    <HStack as="label" gap="2" minH="11" align="center" cursor={props.disabled ? 'not-allowed' : 'pointer'}>
      <NativeInput ref={ref} type="checkbox" boxSize="5" flexShrink={0} accentColor="accent.solid" _focusVisible={focusRing} {...props} />
      <ChoiceLabel label={label} hint={hint} />
    </HStack>
  );
});

export const RadioInput = forwardRef<HTMLInputElement, ChoiceProps>(function RadioInput({ label, hint, ...props }, ref) {
  return (
    <HStack as="label" gap="2" minH="11" align="center" cursor={props.disabled ? 'not-allowed' : 'pointer'}>
      <NativeInput ref={ref} type="radio" boxSize="5" flexShrink={0} accentColor="accent.solid" _focusVisible={focusRing} {...props} />
      <ChoiceLabel label={label} hint={hint} />
    </HStack>
  );
});
