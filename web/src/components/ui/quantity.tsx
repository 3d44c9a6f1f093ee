import { Text, type TextProps } from '@chakra-ui/react';

/** Numbers that line up: quantities, percentages, dates in tables. */
export function Quantity(props: TextProps) {
  return <Text as="span" textStyle="quantity" {...props} />;
}
