import { Box, Heading, Link, Text } from '@chakra-ui/react';
import type { SwapPreview } from '@crumbproof/shared';
import type { ReactNode } from 'react';
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

/** For every product the swap reaches: what its declaration would gain, lose and keep. */
export function SwapResult({ preview, lookup, children }: SwapResultProps) {
  const { from, to, recipes, products } = preview;
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
        {`. ${plural(products.length, 'product is', 'products are')} affected.`}
      </Text>
      {products.length === 0 ? <Text color="fg.muted">No product for sale uses these recipes, so no label changes.</Text> : null}
      <Box as="ul" listStyleType="none" m="0" p="0" display="flex" flexDirection="column" gap="4">
        {products.map((product) => (
          <Box
            as="li"
            key={product.product}
            borderTopWidth="1px"
            borderColor="border.subtle"
            pt="4"
            data-changed={product.diff.changed ? 'true' : 'false'}
            _motionSafe={{ animation: 'fade-in 240ms ease-out' }}
          >
            <Heading as="h3" size="md" mb="2">
              <Link asChild color="accent.fg">
                <RouterLink to={hrefFor(product.product, 'recipe')}>{product.name}</RouterLink>
              </Link>
            </Heading>
            <DeclarationDiffView diff={product.diff} lookup={lookup} claims="all" showReasons />
          </Box>
        ))}
      </Box>
      {children}
    </Panel>
  );
}
