import { Box, Grid, Link, Stack, Text } from '@chakra-ui/react';
import { Link as RouterLink, useLocation, useNavigate, useParams } from 'react-router-dom';
import { LoadFailed } from '@/components/ui/load-failed';
import { Loading } from '@/components/ui/loading';
import { Page } from '@/components/ui/page';
import { isApiError } from '@/lib/api-client';
import { useCreateIngredient } from '../api/create-ingredient';
import { useIngredient } from '../api/get-ingredient';
import { useUpdateIngredient } from '../api/update-ingredient';
import { IngredientForm } from '../components/ingredient-form';
import { RevisionsPanel } from '../components/revisions-panel';
import { SpecificationsPanel } from '../components/specifications-panel';
import { UsedInPanel } from '../components/used-in-panel';

function BackToLibrary() {
  return (
    <Link asChild color="accent.fg">
      <RouterLink to="/ingredients">← All ingredients</RouterLink>
    </Link>
  );
}

export function NewIngredientRoute() {
  const createIngredient = useCreateIngredient();
  const navigate = useNavigate();
  return (
    <Page title="New ingredient" lead="A bought-in ingredient, as its supplier describes it." actions={<BackToLibrary />}>
      <Box maxW="4xl">
        <IngredientForm
          onSave={(ingredient) => createIngredient.mutateAsync(ingredient)}
          saving={createIngredient.isPending}
          onSaved={(saved) => navigate(`/ingredients/${encodeURIComponent(saved.id)}`, { state: { added: saved.name } })}
        />
      </Box>
    </Page>
  );
}

export function IngredientRoute() {
  const { code = '' } = useParams();
  const location = useLocation();
  const ingredient = useIngredient(code);
  const updateIngredient = useUpdateIngredient();
  const added = (location.state as { added?: string } | null)?.added;

  if (ingredient.isPending) return <Loading>Loading the ingredient…</Loading>;
  if (ingredient.isError) {
    const notFound = isApiError(ingredient.error) && ingredient.error.status === 404;
    return (
      <Page title={notFound ? 'Ingredient not found' : 'Ingredient'} actions={<BackToLibrary />}>
        <LoadFailed
          title="The ingredient could not be loaded"
          error={ingredient.error}
          onRetry={notFound ? undefined : () => void ingredient.refetch()}
        />
      </Page>
    );
  }

  const data = ingredient.data;
  return (
    <Page
      title={data.name}
      lead={
        <>
          Ingredient id{' '}
          <Text as="span" fontWeight="bold">
            {data.id}
          </Text>
          , revision {data.revision}.{added ? ` ${added} was added.` : ''}
        </>
      }
      actions={<BackToLibrary />}
    >
      <Grid templateColumns={{ base: 'minmax(0, 1fr)', lg: 'minmax(0, 1fr) minmax(300px, 380px)' }} gap="6" alignItems="start">
        <IngredientForm
          key={data.id}
          ingredient={data}
          onSave={(body, baseRevision) =>
            updateIngredient.mutateAsync({ code: data.id, ingredient: body, baseRevision: baseRevision ?? data.revision })
          }
          saving={updateIngredient.isPending}
          onSaved={() => undefined}
        />
        <Stack gap="4" as="aside" aria-label="About this ingredient">
          <UsedInPanel code={data.id} name={data.name} />
          <SpecificationsPanel code={data.id} />
          <RevisionsPanel code={data.id} />
        </Stack>
      </Grid>
    </Page>
  );
}
