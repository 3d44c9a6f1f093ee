import { HStack, Stack } from '@chakra-ui/react';
import { KITCHEN_WRITERS } from '@crumbproof/shared';
import { useMemo, useState } from 'react';
import { ErrorAlert } from '@/components/ui/error-alert';
import { FormField, TextInput } from '@/components/ui/form-field';
import { LoadFailed } from '@/components/ui/load-failed';
import { Loading } from '@/components/ui/loading';
import { Page } from '@/components/ui/page';
import { useSignedInUser } from '@/lib/signed-in-user';
import { useDeclarations } from '../api/get-declarations';
import { useKitchenRegime } from '../api/get-kitchen-regime';
import { useRecipes } from '@/api/recipes';
import { ActionLink } from '../components/action-link';
import { RecipesTable, type RecipeRow } from '../components/recipes-table';

export function RecipesRoute() {
  const me = useSignedInUser();
  const writer = KITCHEN_WRITERS.includes(me.role);
  const recipes = useRecipes();
  const kitchen = useKitchenRegime();
  const declarations = useDeclarations(kitchen.regime, { enabled: !kitchen.isPending });
  const [query, setQuery] = useState('');

  const rows = useMemo<RecipeRow[]>(() => {
    const byProduct = new Map((declarations.data ?? []).map((d) => [d.product, d]));
    const q = query.trim().toLowerCase();
    return (recipes.data ?? [])
      .filter((recipe) => q === '' || recipe.name.toLowerCase().includes(q) || recipe.id.toLowerCase().includes(q))
      .map((recipe) => ({ recipe, declaration: byProduct.get(recipe.id) }));
  }, [recipes.data, declarations.data, query]);

  return (
    <Page
      title="Recipes"
      lead="Every recipe and product, with the claims each product holds as recorded."
      actions={
        writer ? (
          <HStack gap="3" wrap="wrap">
            <ActionLink to="/recipes/new">New recipe</ActionLink>
            <ActionLink to="/recipes/swap" variant="outline">
              Swap check
            </ActionLink>
          </HStack>
        ) : null
      }
    >
      <Stack maxW="md">
        <FormField label="Search recipes">
          <TextInput type="search" value={query} onChange={(event) => setQuery(event.currentTarget.value)} />
        </FormField>
      </Stack>
      {declarations.isError ? <ErrorAlert title="The declarations could not be computed">{declarations.error.message}</ErrorAlert> : null}
      {recipes.isPending ? (
        <Loading>Loading recipes…</Loading>
      ) : recipes.isError ? (
        <LoadFailed title="The recipes could not be loaded" error={recipes.error} onRetry={() => void recipes.refetch()} />
      ) : (
        <RecipesTable
          rows={rows}
          declarationsReady={!declarations.isPending}
          empty={query ? `No recipe matches “${query}”.` : 'No recipes yet.'}
        />
      )}
    </Page>
  );
}
