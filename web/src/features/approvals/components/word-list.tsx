import { Box } from '@chakra-ui/react';

/** Sentences of a change (approved → now, or printed → approved), one bullet each. */
export function WordList({ words }: { words: readonly string[] }) {
  return (
    <Box as="ul" ps="5" m="0">
      {words.map((w) => (
        <Box as="li" key={w}>
          {w}
        </Box>
      ))}
    </Box>
  );
}
