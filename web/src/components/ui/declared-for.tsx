import { Text, type TextProps } from '@chakra-ui/react';
import type { Regime } from '@crumbproof/shared';

/** "Declared for Saltmarsh Yard Café (EU rules)"; without the rules when they cannot be read. */
export function declaredForWords(kitchen: string, regime: Regime | undefined): string {
  return regime ? `Declared for ${kitchen} (${regime} rules)` : `Declared for ${kitchen}`;
}

interface DeclaredForProps extends Omit<TextProps, 'children'> {
  /** The kitchen's name; nothing is said while it is not known. */
  kitchen: string | undefined;
  regime: Regime | undefined;
}

/**
 * Which kitchen (and under which rules) a declaration answers for: every kitchen of a book has
 * its own handling and regime, so the same product can declare differently in each.
 */
export function DeclaredFor({ kitchen, regime, ...props }: DeclaredForProps) {
  if (!kitchen) return null;
  return (
    <Text fontWeight="bold" color="fg" {...props}>
      {declaredForWords(kitchen, regime)}
    </Text>
  );
}
