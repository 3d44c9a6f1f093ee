import { chakra, HStack, Text } from '@chakra-ui/react';
import { forwardRef, type InputHTMLAttributes, type ReactNode } from 'react';

interface CheckboxProps extends Omit<InputHTMLAttributes<HTMLInputElement>, 'type' | 'size'> {
  children: ReactNode;
}

const NativeCheckbox = chakra('input');

/** A native checkbox with its label around it: dependable with react-hook-form, keyboards and screen readers. */
export const Checkbox = forwardRef<HTMLInputElement, CheckboxProps>(function Checkbox({ children, ...props }, ref) {
  return (
    <HStack as="label" gap="2.5" minH="11" cursor="pointer" align="center">
      <NativeCheckbox
        ref={ref}
        type="checkbox"
        width="5"
        height="5"
        flexShrink={0}
        css={{ accentColor: 'var(--chakra-colors-accent-solid)' }}
        {...props}
      />
      <Text as="span">{children}</Text>
    </HStack>
  );
});
