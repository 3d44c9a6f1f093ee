import { Box, Link, Stack, Text } from '@chakra-ui/react';
import { Link as RouterLink } from 'react-router-dom';
import { LayerPath, type ItemLookup } from '@/components/ui/layer-path';
import { Loading } from '@/components/ui/loading';
import { Panel } from '@/components/ui/panel';
import { useIngredientUsedIn } from '../api/get-ingredient-used-in';

interface UsedInPanelProps {
  code: string;
  name: string;
}

/** Every recipe and product that uses the ingredient, at any depth, with the path down to it. */
export function UsedInPanel({ code, name }: UsedInPanelProps) {
  const usedIn = useIngredientUsedIn(code);
  const names = new Map<string, string>((usedIn.data ?? []).map((entry) => [entry.id, entry.name]));
  const lookup: ItemLookup = (id) =>
    id === code ? { name, kind: 'ingredient' } : names.has(id) ? { name: names.get(id) as string, kind: 'recipe' } : undefined;

  return (
    <Panel title="Used in" size="md">
      {usedIn.isPending ? (
        <Loading size="sm">Finding the recipes that use it…</Loading>
      ) : usedIn.isError ? (
        <Text color="fg.error">Where it is used could not be loaded: {usedIn.error.message}</Text>
      ) : usedIn.data.length === 0 ? (
        <Text color="fg.muted">No recipe or product uses {name} yet.</Text>
      ) : (
        <Stack as="ul" gap="3" listStyleType="none" m="0" p="0">
          {usedIn.data.map((entry) => (
            <Box as="li" key={entry.id}>
              <Text>
                <Link asChild color="accent.fg" fontWeight="bold">
                  <RouterLink to={`/recipes/${encodeURIComponent(entry.id)}`}>{entry.name}</RouterLink>
                </Link>{' '}
                <Text as="span" color="fg.muted" textStyle="sm">
                  {entry.forSale ? 'product for sale' : 'recipe'}
                </Text>
              </Text>
              {entry.paths.map((path, index) => (
                <Box key={index} mt="1.5">
                  <LayerPath path={path} lookup={lookup} />
                </Box>
              ))}
            </Box>
          ))}
        </Stack>
      )}
    </Panel>
  );
}
