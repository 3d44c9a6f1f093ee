import { chakra, HStack, Text } from '@chakra-ui/react';
import { forwardRef, type InputHTMLAttributes, type ReactNode } from 'react';

const NativeInput = chakra('input');

const focusRing = { outline: '2px solid', outlineColor: 'accent.focusRing', outlineOffset: '2px' } as const;

interface ChoiceProps extends Omit<InputHTMLAttributes<HTMLInputElement>, 'type' | 'size' | 'children'> {
  /** The visible label; it names the control. Written as `label` or as the children. */
  label?: ReactNode;
  children?: ReactNode;
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
 * A native checkbox or radio input, labelled by its wrapping <label>: the most dependable choice
 * for keyboards, touch, screen readers and react-hook-form. At least 44 px tall to touch.
 */
function choiceInput(type: 'checkbox' | 'radio') {
  return forwardRef<HTMLInputElement, ChoiceProps>(function ChoiceInput({ label, children, hint, ...props }, ref) {
    return (
      <HStack as="label" gap="2" minH="11" align="center" cursor={props.disabled ? 'not-allowed' : 'pointer'}>
        <NativeInput ref={ref} type={type} boxSize="5" flexShrink={0} accentColor="accent.solid" _focusVisible={focusRing} {...props} />
        <ChoiceLabel label={label ?? children} hint={hint} />
      </HStack>
    );
  });
}

export const CheckboxInput = choiceInput('checkbox');
export const RadioInput = choiceInput('radio');
