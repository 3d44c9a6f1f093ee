import { HStack, Spinner, Text } from '@chakra-ui/react';

interface LoadingProps {
  /** What is being waited for, in words: "Loading the recipe…". */
  children: string;
  /** `md` for a page, `sm` inside a panel, `xs` inline beside a heading. */
  size?: 'xs' | 'sm' | 'md' | 'lg';
}

/** Something is on its way: a spinner and the words, announced politely. */
export function Loading({ children, size = 'md' }: LoadingProps) {
  return (
    <HStack role="status" gap={size === 'md' || size === 'lg' ? '3' : '2'} align="center">
      <Spinner color="accent.solid" size={size} />
      <Text textStyle={size === 'xs' ? 'sm' : undefined}>{children}</Text>
    </HStack>
  );
}
