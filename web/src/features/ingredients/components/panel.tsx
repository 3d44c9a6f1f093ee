import { Box, Heading, HStack, Spinner, Text } from '@chakra-ui/react';
import { useId, type ReactNode } from 'react';

interface SidePanelProps {
  title: string;
  children: ReactNode;
}

/** A titled side panel on the ingredient page (Used in, Specifications, Revisions). */
export function SidePanel({ title, children }: SidePanelProps) {
  const headingId = useId();
  return (
    <Box as="section" aria-labelledby={headingId} bg="bg.panel" borderWidth="1px" borderColor="border.muted" rounded="md" p="4">
      <Heading as="h2" size="md" id={headingId} mb="3">
        {title}
      </Heading>
      {children}
    </Box>
  );
}

export function PanelLoading({ children }: { children: string }) {
  return (
    <HStack role="status" gap="2">
      <Spinner size="sm" color="accent.solid" />
      <Text>{children}</Text>
    </HStack>
  );
}
