import { Box, Heading, Stack } from '@chakra-ui/react';
import { useId, type ReactNode } from 'react';

export type HeadingLevel = 'h2' | 'h3';

interface PanelProps {
  title: string;
  /** The heading's level in the page's outline; h2 by default. */
  level?: HeadingLevel;
  /** The heading's size: by default large for an h2, medium for an h3 (side panels use medium). */
  size?: 'sm' | 'md' | 'lg';
  /** Controls or a status beside the heading. */
  aside?: ReactNode;
  children: ReactNode;
}

/** A named region of a page: a section on the panel ground, labelled by its own heading. */
export function Panel({ title, level = 'h2', size, aside, children }: PanelProps) {
  const headingId = useId();
  return (
    <Box as="section" aria-labelledby={headingId} bg="bg.panel" borderWidth="1px" borderColor="border.muted" rounded="md" p="4" minW="0">
      <Stack gap="3">
        <Stack direction="row" justify="space-between" align="baseline" gap="3" wrap="wrap">
          <Heading as={level} id={headingId} size={size ?? (level === 'h2' ? 'lg' : 'md')}>
            {title}
          </Heading>
          {aside}
        </Stack>
        {children}
      </Stack>
    </Box>
  );
}
