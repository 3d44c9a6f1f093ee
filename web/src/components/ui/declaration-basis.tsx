import { Box, Link, Text } from '@chakra-ui/react';
import type { DeclarationBasis, DeclarationBasisItem, SpecificationReviewWarning } from '@crumbproof/shared';
import { Link as RouterLink } from 'react-router-dom';
import { formatDateTime } from '@/lib/format';
import { hrefFor, useCanOpenPath } from './layer-path';
import { Quantity } from './quantity';

const timeFormat = new Intl.DateTimeFormat('en-GB', { hour: '2-digit', minute: '2-digit' });

/** "10:42" for today, "3 Jun 2026, 10:42" for an earlier day. */
export function workedOutAt(iso: string, now = new Date()): string {
  const at = new Date(iso);
  if (Number.isNaN(at.getTime())) return iso;
  return at.toDateString() === now.toDateString() ? timeFormat.format(at) : formatDateTime(iso);
}

function count(n: number, one: string, many: string): string {
  return `${n} ${n === 1 ? one : many}`;
}

/** "a, b and c". */
function listOf(parts: readonly string[]): string {
  return parts.length <= 1 ? (parts[0] ?? '') : `${parts.slice(0, -1).join(', ')} and ${parts.at(-1)}`;
}

/**
 * "from revision 3 of this recipe, 2 sub-recipes and 7 ingredients at their current revisions,
 * with version 4 of the kitchen settings."
 */
export function basisFrom(basis: DeclarationBasis): string {
  const [product, ...rest] = basis.items;
  const recipes = rest.filter((item) => item.kind === 'recipe').length;
  const ingredients = rest.length - recipes;
  const parts = [
    product ? `revision ${product.revision} of this recipe` : 'this recipe',
    ...(recipes > 0 ? [count(recipes, 'sub-recipe', 'sub-recipes')] : []),
    ...(ingredients > 0 ? [count(ingredients, 'ingredient', 'ingredients')] : []),
  ];
  const current = rest.length === 0 ? '' : rest.length === 1 ? ' at its current revision' : ' at their current revisions';
  return `from ${listOf(parts)}${current}, with version ${basis.siteVersion} of the kitchen settings.`;
}

function ItemName({ item }: { item: DeclarationBasisItem }) {
  const canOpen = useCanOpenPath();
  const href = hrefFor(item.id, item.kind);
  if (!canOpen(href)) {
    return (
      <Text as="span" fontWeight="bold">
        {item.name}
      </Text>
    );
  }
  return (
    <Link asChild color="accent.fg" fontWeight="bold">
      <RouterLink to={href}>{item.name}</RouterLink>
    </Link>
  );
}

/**
 * Where a served declaration comes from, in one line under it: when it was worked out and from
 * which revisions, with every item and its revision one click away.
 */
export function DeclarationBasisLine({ basis }: { basis: DeclarationBasis }) {
  const [, ...rest] = basis.items;
  return (
    <Box role="note" aria-label="What this declaration was worked out from" textStyle="sm" color="fg.muted" maxW="80ch">
      <Text>
        {'Worked out '}
        <time dateTime={basis.computedAt}>{workedOutAt(basis.computedAt)}</time> {basisFrom(basis)}
      </Text>
      {rest.length > 0 ? (
        <Box as="details" mt="1">
          <Box as="summary" cursor="pointer" color="fg" fontWeight="bold" minH="8" display="list-item">
            The revisions it used
          </Box>
          <Box as="ul" ps="5" m="0" mt="1" color="fg">
            {rest.map((item) => (
              <li key={`${item.kind}-${item.id}`}>
                <ItemName item={item} />
                {`, ${item.kind === 'recipe' ? 'sub-recipe' : 'ingredient'}: `}
                <Quantity>{`revision ${item.revision}`}</Quantity>
              </li>
            ))}
          </Box>
        </Box>
      ) : null}
    </Box>
  );
}

/**
 * The ingredients below a product whose supplier specification is overdue for review, as of
 * the day the declaration was served: said beside the basis, never blocking anything.
 */
export function ReviewWarnings({ warnings }: { warnings: readonly SpecificationReviewWarning[] | undefined }) {
  if (!warnings || warnings.length === 0) return null;
  return (
    <Box
      as="section"
      aria-label="Specifications overdue for review"
      borderStartWidth="4px"
      borderColor="fg.muted"
      bg="bg.subtle"
      p="3"
      rounded="md"
    >
      <Text fontWeight="bold">
        Specification overdue for review: {warnings.length === 1 ? warnings[0]!.name : `${warnings.length} ingredients`}
      </Text>
      <Box as="ul" ps="5" m="0">
        {warnings.map((warning) => (
          <li key={warning.ingredient}>{warning.message}</li>
        ))}
      </Box>
    </Box>
  );
}
