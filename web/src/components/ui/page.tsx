import { Heading, Stack, Text } from '@chakra-ui/react';
import { useEffect, type ReactNode } from 'react';

interface PageProps {
  title: string;
  /** One sentence under the heading saying what the page is for. */
  lead?: ReactNode;
  actions?: ReactNode;
  children?: ReactNode;
}

/** Every page has exactly one h1, and the browser tab names the page. */
export function Page({ title, lead, actions, children }: PageProps) {
  useEffect(() => {
    document.title = `${title} · Crumbproof`;
  }, [title]);

  return (
    <Stack gap="6">
      <Stack gap="2" direction={{ base: 'column', md: 'row' }} justify="space-between" align={{ md: 'flex-end' }}>
        <Stack gap="2">
          <Heading as="h1" size="2xl" color="fg">
            {title}
          </Heading>
          {lead ? (
            <Text color="fg.muted" maxW="65ch">
              {lead}
            </Text>
          ) : null}
        </Stack>
        {actions}
      </Stack>
      {children}
    </Stack>
  );
}
