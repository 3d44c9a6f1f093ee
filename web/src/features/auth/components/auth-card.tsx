import { Box, Heading, Stack, Text } from '@chakra-ui/react';
import type { ReactNode } from 'react';
import { BrandMark } from '@/components/ui/brand-mark';

interface AuthCardProps {
  title: string;
  /** One sentence under the heading: what to do here. */
  lead: string;
  children: ReactNode;
}

/** The card the signed-out pages stand on: the mark, the page's one heading, a sentence, the form. */
export function AuthCard({ title, lead, children }: AuthCardProps) {
  return (
    <Box w="full" maxW="md" mx="auto" bg="bg.panel" borderWidth="1px" borderColor="border.muted" rounded="lg" p={{ base: '6', md: '8' }}>
      <Stack gap="6">
        <Stack gap="3" align="flex-start">
          <BrandMark size="40px" />
          <Heading as="h1" size="2xl">
            {title}
          </Heading>
          <Text color="fg.muted">{lead}</Text>
        </Stack>
        {children}
      </Stack>
    </Box>
  );
}
