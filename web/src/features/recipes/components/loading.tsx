import { Spinner, Stack, Text } from '@chakra-ui/react';

export function Loading({ children }: { children: string }) {
  return (
    <Stack role="status" direction="row" align="center" gap="3">
      <Spinner color="accent.solid" />
      <Text>{children}</Text>
    </Stack>
  );
}
