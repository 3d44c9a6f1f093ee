import { Box, Text } from '@chakra-ui/react';
import type { BookIngredient } from '@crumbproof/shared';
import { describeEntry, yesNoUnknown } from '../utils/ingredient-facts';

/** "Milk, Hazelnut"; "None (the supplier states none)"; "Not known (no allergen statement)". */
export function containsWords(ingredient: Pick<BookIngredient, 'contains'>): string {
  if (ingredient.contains === undefined) return 'Not known (no allergen statement)';
  if (ingredient.contains.length === 0) return 'None (the supplier states none)';
  return ingredient.contains.map(describeEntry).join(', ');
}

/** The supplier's precautionary statement; an empty list is no statement. */
export function mayContainWords(ingredient: Pick<BookIngredient, 'mayContain'>): string {
  if (!ingredient.mayContain || ingredient.mayContain.length === 0) return 'No precautionary statement';
  return ingredient.mayContain.map(describeEntry).join(', ');
}

/** What a row would record for the ingredient, in words, with "not known" kept apart from "none". */
export function ImportRowSummary({ ingredient }: { ingredient: BookIngredient | null }) {
  if (!ingredient) {
    return (
      <Text as="span" color="fg.muted">
        Nothing: the row cannot be read until its problems are corrected.
      </Text>
    );
  }
  const facts: [string, string][] = [
    ['Contains', containsWords(ingredient)],
    ['May contain', mayContainWords(ingredient)],
    ['Vegan', yesNoUnknown(ingredient.vegan)],
    ['Vegetarian', yesNoUnknown(ingredient.vegetarian)],
  ];
  return (
    <Box as="dl" m="0" display="grid" gridTemplateColumns="auto 1fr" columnGap="2" rowGap="0.5" whiteSpace="normal">
      {facts.map(([term, words]) => (
        <Box key={term} display="contents">
          <Box as="dt" fontWeight="bold">
            {term}:
          </Box>
          <Box as="dd" m="0" overflowWrap="anywhere">
            {words}
          </Box>
        </Box>
      ))}
    </Box>
  );
}
