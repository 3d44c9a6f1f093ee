import { Box, Text } from '@chakra-ui/react';
import type { ReactNode } from 'react';

interface TitledListProps<T> {
  /** The bold line above the list. */
  title: ReactNode;
  items: readonly T[];
  /** A key for each item, stable between renders. */
  itemKey: (item: T, index: number) => string;
  children: (item: T) => ReactNode;
  /** An error list is titled in the error colour, its words saying so too. */
  tone?: 'error';
}

/** A bold title over a bulleted list; nothing at all when the list is empty. */
export function TitledList<T>({ title, items, itemKey, children, tone }: TitledListProps<T>) {
  if (items.length === 0) return null;
  return (
    <Box>
      <Text fontWeight="bold" color={tone === 'error' ? 'fg.error' : undefined}>
        {title}
      </Text>
      <Box as="ul" ps="5" m="0">
        {items.map((item, index) => (
          <li key={itemKey(item, index)}>{children(item)}</li>
        ))}
      </Box>
    </Box>
  );
}
