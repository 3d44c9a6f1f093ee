import { Box, Heading, Stack } from '@chakra-ui/react';
import { useId, type ReactNode } from 'react';

export type HeadingLevel = 'h2' | 'h3';

interface PanelSectionProps {
  title: string;
  level: HeadingLevel;
  children: ReactNode;
  /** Extra controls beside the heading. */
  aside?: ReactNode;
}

/** One named region of a declaration: a section labelled by its own heading. */
export function PanelSection({ title, level, children, aside }: PanelSectionProps) {
  const headingId = useId();
  return (
    <Box as="section" aria-labelledby={headingId} bg="bg.panel" borderWidth="1px" borderColor="border.muted" rounded="md" p="4" minW="0">
      <Stack gap="3">
        <Stack direction="row" justify="space-between" align="baseline" gap="3" wrap="wrap">
          <Heading as={level} id={headingId} size={level === 'h2' ? 'lg' : 'md'}>
            {title}
          </Heading>
          {aside}
        </Stack>
        {children}
      </Stack>
    </Box>
  );
}
