import { Box, Heading, Link, Stack, Text } from '@chakra-ui/react';
import { declaredChange, declaredChangeInWords, REGIME_LABELS, type StandIn, type SwapPreview, type SwapProduct } from '@crumbproof/shared';
import { useId, type ReactNode } from 'react';
import { Link as RouterLink } from 'react-router-dom';
import { DeclarationDiffView } from '@/components/ui/declaration-diff-view';
import { hrefFor, type ItemLookup } from '@/components/ui/layer-path';
import { Panel } from '@/components/ui/panel';

interface SwapResultProps {
  preview: SwapPreview;
  lookup: ItemLookup;
  /** The apply button and its confirmation, under the products. */
  children?: ReactNode;
}

function plural(n: number, one: string, many: string) {
  return `${n} ${n === 1 ? one : many}`;
}

/** The product's place on the page, for the summary's links. */
const anchorOf = (product: SwapProduct) => `swap-${product.kitchen.id}-${product.product}`;

/**
 * What the swap changes in a product's declaration, in a line or two: the allergens, the claims,
 * the percentages and what is not known; the new ingredient list is given in full below.
 */
function changeInWords(product: SwapProduct): string {
  const change = declaredChange(product.before, product.after);
  const words = declaredChangeInWords({ ...change, ingredientsText: null });
  if (words.length > 0) return words.join(' ');
  return change.ingredientsText ? 'Allergens and claims stay as they are; the ingredient list changes.' : 'Its declaration stays as it is.';
}

/** Every product reached, a line each, before the details: what a chef reads first for an ingredient used widely. */
function SwapSummary({ preview }: { preview: SwapPreview }) {
  const several = preview.kitchens.length > 1;
  const groups = several
    ? preview.kitchens.map((kitchen) => ({ kitchen, products: preview.products.filter((p) => p.kitchen.id === kitchen.id) }))
    : [{ kitchen: null, products: preview.products }];
  return (
    <Box as="nav" aria-label="At a glance" bg="bg.subtle" rounded="md" p="3" minW="0">
      <Heading as="h3" size="md" mb="2">
        At a glance
      </Heading>
      <Stack gap="3">
        {groups
          .filter((group) => group.products.length > 0)
          .map((group) => (
            <Stack key={group.kitchen?.id ?? 'one'} gap="1">
              {group.kitchen ? <Text fontWeight="bold">{group.kitchen.name}</Text> : null}
              <Box as="ul" m="0" ps="5">
                {group.products.map((product) => (
                  <Box as="li" key={anchorOf(product)} mb="1">
                    <Link href={`#${anchorOf(product)}`} color="accent.fg" fontWeight="bold">
                      {product.name}
                    </Link>
                    {`: ${changeInWords(product)}`}
                  </Box>
                ))}
              </Box>
            </Stack>
          ))}
      </Stack>
    </Box>
  );
}

const sameLine = (a: StandIn, b: StandIn) => a.recipe === b.recipe && a.line === b.line;

/** What the kitchen makes with its own ingredients in this product, and which of those the swap ends, in sentences. */
function standInWords({ standIns }: SwapProduct, lookup: ItemLookup, to: string): string[] {
  const recipeName = (id: string) => lookup(id)?.name ?? id;
  const ended = standIns.before.filter((s) => !standIns.after.some((a) => sameLine(a, s)));
  return [
    ...standIns.after.map((s) => `Made here with ${s.withName} in place of ${s.replacesName} (${recipeName(s.recipe)}, line ${s.line}).`),
    ...ended.map(
      (s) =>
        `Was made here with ${s.withName} in place of ${s.replacesName} (${recipeName(s.recipe)}, line ${s.line}); after the swap that line uses ${to}, as the book says.`,
    ),
  ];
}

interface ProductListProps {
  products: SwapProduct[];
  lookup: ItemLookup;
  to: string;
  /** The heading level of each product: h3 alone, h4 under its kitchen's heading. */
  level: 'h3' | 'h4';
}

function ProductList({ products, lookup, to, level }: ProductListProps) {
  return (
    <Box as="ul" listStyleType="none" m="0" p="0" display="flex" flexDirection="column" gap="4">
      {products.map((product) => (
        <Box
          as="li"
          key={`${product.kitchen.id} ${product.product}`}
          id={anchorOf(product)}
          scrollMarginTop="24"
          borderTopWidth="1px"
          borderColor="border.subtle"
          pt="4"
          minW="0"
          data-changed={product.diff.changed ? 'true' : 'false'}
          _motionSafe={{ animation: 'fade-in 240ms ease-out' }}
        >
          <Heading as={level} size="md" mb="2">
            <Link asChild color="accent.fg">
              <RouterLink to={hrefFor(product.product, 'recipe')}>{product.name}</RouterLink>
            </Link>
          </Heading>
          {standInWords(product, lookup, to).map((line) => (
            <Text key={line} mb="2" color="fg.muted">
              {line}
            </Text>
          ))}
          <DeclarationDiffView diff={product.diff} lookup={lookup} claims="all" showReasons />
        </Box>
      ))}
    </Box>
  );
}

interface KitchenGroupProps {
  kitchen: SwapPreview['kitchens'][number];
  products: SwapProduct[];
  lookup: ItemLookup;
  to: string;
}

/** One kitchen's products, under its name, as that kitchen makes and declares them. */
function KitchenGroup({ kitchen, products, lookup, to }: KitchenGroupProps) {
  const headingId = useId();
  return (
    <Box as="section" aria-labelledby={headingId} borderTopWidth="2px" borderColor="border.muted" pt="3" minW="0">
      <Stack direction="row" justify="space-between" align="baseline" gap="3" wrap="wrap">
        <Heading as="h3" id={headingId} size="lg">
          {kitchen.name}
        </Heading>
        <Text color="fg.muted">
          {`${REGIME_LABELS[kitchen.regime]} rules · ${kitchen.products === 0 ? 'no product affected' : plural(kitchen.products, 'product affected', 'products affected')}`}
        </Text>
      </Stack>
      {products.length === 0 ? (
        <Text mt="2" color="fg.muted">
          {`No product for sale at ${kitchen.name} changes: it does not sell these products, or makes them the same either way.`}
        </Text>
      ) : (
        <ProductList products={products} lookup={lookup} to={to} level="h4" />
      )}
    </Box>
  );
}

/**
 * For every product the swap reaches: what its declaration would gain, lose and keep. In an
 * installation of several kitchens, grouped by kitchen, each product as that kitchen declares it.
 */
export function SwapResult({ preview, lookup, children }: SwapResultProps) {
  const { from, to, recipes, products, kitchens } = preview;
  const several = kitchens.length > 1;
  const reached = kitchens.filter((kitchen) => kitchen.products > 0).length;
  return (
    <Panel title="Swap result">
      <Text>
        {`Replacing ${from.name} with ${to.name} changes ${plural(recipes.length, 'recipe', 'recipes')}: `}
        {recipes.map((recipe, index) => (
          <span key={recipe.id}>
            {index > 0 ? ', ' : ''}
            <Link asChild color="accent.fg" fontWeight="bold">
              <RouterLink to={hrefFor(recipe.id, 'recipe')}>{recipe.name}</RouterLink>
            </Link>
            {` (${plural(recipe.lines, 'line', 'lines')})`}
          </span>
        ))}
        {`. ${plural(products.length, 'product is', 'products are')} affected${
          several ? ` at ${plural(reached, 'kitchen', 'kitchens')} of ${kitchens.length}` : ''
        }.`}
      </Text>
      {several ? (
        <Text color="fg.muted">The recipes are shared by every kitchen: applying the swap changes them for all of them at once.</Text>
      ) : null}
      {products.length === 0 ? <Text color="fg.muted">No product for sale uses these recipes, so no label changes.</Text> : null}
      {products.length > 1 ? <SwapSummary preview={preview} /> : null}
      {several ? (
        kitchens.map((kitchen) => (
          <KitchenGroup
            key={kitchen.id}
            kitchen={kitchen}
            products={products.filter((product) => product.kitchen.id === kitchen.id)}
            lookup={lookup}
            to={to.name}
          />
        ))
      ) : (
        <ProductList products={products} lookup={lookup} to={to.name} level="h3" />
      )}
      {children}
    </Panel>
  );
}
