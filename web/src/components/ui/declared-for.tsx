import { Stack, Text, type TextProps } from '@chakra-ui/react';
import type { Regime, StandIn } from '@crumbproof/shared';

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

/** "Line 2 of Shortbread is made here with Corner flour in place of Plain flour. Milled next door." */
export function standInWords(s: StandIn, recipeName: string): string {
  const note = s.note?.trim();
  const sentence = note ? ` ${note}${/[.!?]$/.test(note) ? '' : '.'}` : '';
  return `Line ${s.line} of ${recipeName} is made here with ${s.withName} in place of ${s.replacesName}.${sentence}`;
}

interface StandInsProps {
  standIns: readonly StandIn[] | undefined;
  /** A recipe's name by its id, for the lines' recipes; the id when it is not known. */
  nameOf: (id: string) => string;
}

/**
 * The lines this kitchen makes with its own ingredient in place of the book's shared one: what
 * makes its declaration differ from another kitchen's of the same recipe. Nothing when there are none.
 */
export function StandIns({ standIns, nameOf }: StandInsProps) {
  if (!standIns || standIns.length === 0) return null;
  return (
    <Stack gap="1" aria-label="Made here with the kitchen's own ingredients">
      <Text fontWeight="bold">Made here with this kitchen’s own ingredients</Text>
      {standIns.map((s) => (
        <Text key={`${s.recipe} ${s.line}`} fontSize="sm" color="fg.muted">
          {standInWords(s, nameOf(s.recipe))}
        </Text>
      ))}
    </Stack>
  );
}
