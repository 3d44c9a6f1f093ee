import { List, Stack, Text } from '@chakra-ui/react';
import type { KitchenMakes } from '@crumbproof/shared';

const lines = (n: number) => (n === 1 ? '1 recipe line' : `${n} recipe lines`);

/**
 * What this kitchen makes differently from the recipe book every kitchen shares: each of its own
 * ingredients standing in for a shared one (a substitution recorded on the kitchen, never made
 * silently), and the products it sells. Both are kept in the recipe book and change by importing it.
 */
export function KitchenMakesView({ makes }: { makes: KitchenMakes }) {
  return (
    <Stack gap="4">
      <Stack gap="2">
        <Text fontWeight="bold">Its own ingredients in place of the book’s</Text>
        {makes.substitutions.length === 0 ? (
          <Text color="fg.muted">None: every recipe line here uses the book’s shared ingredient.</Text>
        ) : (
          <List.Root gap="1" ps="5" aria-label="Stand-ins at this kitchen">
            {makes.substitutions.map((sub) => (
              <List.Item key={sub.replaces.id}>
                <Text as="span" fontWeight="bold">
                  {sub.with.name}
                </Text>
                {sub.with.supplier && !sub.with.name.includes(sub.with.supplier) ? ` (${sub.with.supplier})` : ''}
                {` in place of ${sub.replaces.name}, on ${lines(sub.lines)}.`}
                {sub.note ? (
                  <Text as="span" color="fg.muted">
                    {` ${sub.note}`}
                  </Text>
                ) : null}
              </List.Item>
            ))}
          </List.Root>
        )}
        {makes.substitutions.length > 0 ? (
          <Text color="fg.muted" fontSize="sm">
            Each product made with one says so under its declaration; check the kitchen’s own supplier’s allergen statement as you would any
            other.
          </Text>
        ) : null}
      </Stack>
      <Stack gap="2">
        <Text fontWeight="bold">On sale here</Text>
        {makes.sells === null ? (
          <Text>Every product for sale in the recipe book.</Text>
        ) : (
          <>
            <Text>
              {makes.sells.length === 0
                ? 'Nothing: this kitchen’s list of products is empty.'
                : `${makes.sells.length} of the book’s ${makes.sells.length + makes.notSold.length} products for sale: ${makes.sells.map((p) => p.name).join(', ')}.`}
            </Text>
            {makes.notSold.length > 0 ? (
              <Text color="fg.muted">{`Not sold here: ${makes.notSold.map((p) => p.name).join(', ')}.`}</Text>
            ) : null}
          </>
        )}
      </Stack>
      <Text color="fg.muted" fontSize="sm">
        Both are kept in the recipe book, with this kitchen: to change them, import the book again with this kitchen’s substitutions or list
        of products changed.
      </Text>
    </Stack>
  );
}
