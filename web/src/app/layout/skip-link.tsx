import { Link } from '@chakra-ui/react';

export const MAIN_ID = 'main';

/** The first stop for keyboard users: jumps past the header and navigation. */
export function SkipLink() {
  return (
    <Link
      href={`#${MAIN_ID}`}
      position="absolute"
      insetStart="4"
      top="-20"
      zIndex="skipLink"
      px="4"
      py="3"
      bg="accent.solid"
      color="accent.contrast"
      fontWeight="bold"
      rounded="md"
      _focusVisible={{ top: '4', outline: '3px solid', outlineColor: 'fg', outlineOffset: '2px' }}
    >
      Skip to main content
    </Link>
  );
}
