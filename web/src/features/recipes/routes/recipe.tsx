import { Link, Stack, Text } from '@chakra-ui/react';
import { KITCHEN_WRITERS, type Regime } from '@crumbproof/shared';
import { useMemo } from 'react';
import { Link as RouterLink, useLocation, useParams, useSearchParams } from 'react-router-dom';
import { useKitchenName } from '@/api/kitchen';
import { useRecipes } from '@/api/recipes';
import { DeclarationBasisLine, ReviewWarnings } from '@/components/ui/declaration-basis';
import { DeclaredFor, StandIns } from '@/components/ui/declared-for';
import { ErrorAlert } from '@/components/ui/error-alert';
import { buildItemLookup } from '@/components/ui/item-lookup';
import { LayerPathLinks } from '@/components/ui/layer-path';
import { Loading } from '@/components/ui/loading';
import { Page } from '@/components/ui/page';
import { isApiError } from '@/lib/api-client';
import { formatDate } from '@/lib/format';
import { useSignedInUser } from '@/lib/signed-in-user';
import { useDeclaration } from '@/api/declaration';
import { isRegime, useKitchenRegime } from '../api/get-kitchen-regime';
import { useRecipe } from '../api/get-recipe';
import { ActionLink } from '../components/action-link';
import { DeclarationPanel } from '../components/declaration-panel';
import { NutritionPanel } from '../components/nutrition-panel';
import { RegimeSelect } from '../components/regime-select';
import { RevisionHistory } from '../components/revision-history';

/** Set by the editor after a save, so the product page can say which revision it now shows. */
export interface SavedState {
  savedRevision?: number;
}

/** The product page: a recipe's declaration under a regime, its nutrition and (for writers) its history. */
export function RecipeRoute() {
  const { code = '' } = useParams();
  const me = useSignedInUser();
  const writer = KITCHEN_WRITERS.includes(me.role);
  const location = useLocation();
  const saved = (location.state as SavedState | null)?.savedRevision;
  const [search, setSearch] = useSearchParams();
  const asked = search.get('regime');
  const kitchen = useKitchenRegime();
  const kitchenName = useKitchenName();
  const regime: Regime | undefined = isRegime(asked) ? asked : kitchen.regime;

  const recipe = useRecipe(code);
  const recipes = useRecipes();
  const declaration = useDeclaration(code, regime, { enabled: isRegime(asked) || !kitchen.isPending });
  const lookup = useMemo(
    () => buildItemLookup({ recipes: recipes.data, declarations: [declaration.data] }),
    [recipes.data, declaration.data],
  );

  function handleRegime(next: Regime) {
    setSearch(
      (params) => {
        const copy = new URLSearchParams(params);
        if (next === kitchen.regime) copy.delete('regime');
        else copy.set('regime', next);
        return copy;
      },
      { replace: true },
    );
  }

  if (recipe.isPending) return <Loading>Loading the recipe…</Loading>;
  if (recipe.isError) {
    const missing = isApiError(recipe.error) && recipe.error.status === 404;
    return (
      <Page title={missing ? 'Recipe not found' : 'The recipe could not be loaded'}>
        <ErrorAlert>{recipe.error.message}</ErrorAlert>
        <Link asChild color="accent.fg" fontWeight="bold" alignSelf="flex-start">
          <RouterLink to="/recipes">Back to recipes</RouterLink>
        </Link>
      </Page>
    );
  }

  const data = recipe.data;
  const kind = data.sale ? `For sale, portion ${data.sale.portionG} g` : 'Sub-recipe';
  return (
    <Page
      title={data.name}
      lead={`${kind} · Revision ${data.revision}, updated ${formatDate(data.updatedAt)}`}
      actions={
        <Stack direction={{ base: 'column', md: 'row' }} gap="4" align={{ md: 'flex-end' }}>
          <RegimeSelect value={regime} kitchenRegime={kitchen.regime} onChange={handleRegime} />
          {writer ? <ActionLink to={`/recipes/${encodeURIComponent(data.id)}/edit`}>Edit recipe</ActionLink> : null}
        </Stack>
      }
    >
      {saved !== undefined ? (
        <Text role="status" fontWeight="bold" bg="accent.subtle" px="3" py="2" rounded="md">
          {`Saved. This is revision ${saved}.`}
        </Text>
      ) : null}
      {declaration.isPending ? (
        <Loading>Computing the declaration…</Loading>
      ) : declaration.isError ? (
        <ErrorAlert title="The declaration could not be computed">{declaration.error.message}</ErrorAlert>
      ) : (
        // Front of house cannot open ingredient pages: those bars and names are drawn without a link.
        <LayerPathLinks canOpen={(href) => writer || !href.startsWith('/ingredients/')}>
          <Stack gap="4">
            <DeclaredFor kitchen={kitchenName} regime={declaration.data.regime} fontSize="lg" />
            <StandIns
              standIns={declaration.data.basis.standIns}
              nameOf={(id) => declaration.data.basis.items.find((i) => i.id === id)?.name ?? id}
            />
            <DeclarationBasisLine basis={declaration.data.basis} />
            <ReviewWarnings warnings={declaration.data.reviewWarnings} />
            <DeclarationPanel
              declaration={declaration.data}
              lookup={lookup}
              wanted={data.sale ? data.sale.claims : undefined}
              claimBasis={declaration.data.claimBasis}
            />
            <NutritionPanel nutrition={declaration.data.nutrition} />
          </Stack>
        </LayerPathLinks>
      )}
      {writer ? <RevisionHistory code={data.id} lookup={lookup} /> : null}
    </Page>
  );
}
