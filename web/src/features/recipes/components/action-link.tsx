import { Link } from '@chakra-ui/react';
import type { ReactNode } from 'react';
import { Link as RouterLink } from 'react-router-dom';

interface ActionLinkProps {
  to: string;
  children: ReactNode;
  variant?: 'solid' | 'outline';
}

/** A link that looks like a button: it goes somewhere rather than doing something. */
export function ActionLink({ to, children, variant = 'solid' }: ActionLinkProps) {
  const solid = variant === 'solid';
  return (
    <Link
      asChild
      display="inline-flex"
      alignItems="center"
      minH="11"
      px="4"
      rounded="md"
      borderWidth="1px"
      borderColor="accent.solid"
      bg={solid ? 'accent.solid' : 'bg.panel'}
      color={solid ? 'accent.contrast' : 'accent.fg'}
      fontWeight="bold"
      whiteSpace="nowrap"
      textDecoration="none"
      _hover={{ bg: solid ? 'accent.hover' : 'accent.subtle', textDecoration: 'none' }}
    >
      <RouterLink to={to}>{children}</RouterLink>
    </Link>
  );
}
