import { KITCHEN_WRITERS, type RecipeView } from '@crumbproof/shared';
import { useMemo } from 'react';
import { useNavigate, useParams } from 'react-router-dom';
import { ErrorAlert } from '@/components/ui/error-alert';
import type { ComboboxOption } from '@/components/ui/item-combobox';
import { buildItemLookup } from '@/components/ui/item-lookup';
import { Loading } from '@/components/ui/loading';
import { Page } from '@/components/ui/page';
import { RoleRequired } from '@/components/ui/role-required';
import { useIngredients } from '@/api/ingredients';
import { useRecipe } from '../api/get-recipe';
import { useRecipes } from '@/api/recipes';
import { RecipeEditorForm } from '../components/recipe-editor-form';
import type { SavedState } from './recipe';

/** Everything a line may use: recipes (other than this one) and ingredients, by name. */
function useLineChoices(exclude: string | null) {
  const recipes = useRecipes();
  const ingredients = useIngredients();
  const options = useMemo<ComboboxOption[]>(() => {
    const fromRecipes = (recipes.data ?? [])
      .filter((recipe) => recipe.id !== exclude)
      .map((recipe) => ({ value: recipe.id, label: recipe.name, hint: 'Recipe' }));
    const fromIngredients = (ingredients.data ?? []).map((ingredient) => ({
      value: ingredient.id,
      label: ingredient.name,
      hint: 'Ingredient',
    }));
    return [...fromIngredients, ...fromRecipes].sort((a, b) => a.label.localeCompare(b.label));
  }, [recipes.data, ingredients.data, exclude]);
  const lookup = useMemo(() => buildItemLookup({ recipes: recipes.data, ingredients: ingredients.data }), [recipes.data, ingredients.data]);
  const problem = recipes.error ?? ingredients.error ?? null;
  return { options, lookup, problem };
}

function useOpenSaved() {
  const navigate = useNavigate();
  return (saved: RecipeView) =>
    navigate(`/recipes/${encodeURIComponent(saved.id)}`, { state: { savedRevision: saved.revision } satisfies SavedState });
}

function EditRecipe() {
  const { code = '' } = useParams();
  const recipe = useRecipe(code);
  const { options, lookup, problem } = useLineChoices(code);
  const openSaved = useOpenSaved();

  if (recipe.isPending) return <Loading>Loading the recipe…</Loading>;
  if (recipe.isError) {
    return (
      <Page title="The recipe could not be loaded">
        <ErrorAlert>{recipe.error.message}</ErrorAlert>
      </Page>
    );
  }
  return (
    <Page title={`Edit ${recipe.data.name}`} lead="The live declaration follows every change; nothing is saved until you save.">
      {problem ? <ErrorAlert title="The list of ingredients and recipes could not be loaded">{problem.message}</ErrorAlert> : null}
      <RecipeEditorForm
        // Kept while the recipe is read again: the form holds the revision it was loaded from, and a
        // save from it is refused when someone saved a later one (nothing typed is dropped unseen).
        key={recipe.data.id}
        initial={recipe.data}
        options={options}
        lookup={lookup}
        onSaved={openSaved}
      />
    </Page>
  );
}

function NewRecipe() {
  const { options, lookup, problem } = useLineChoices(null);
  const openSaved = useOpenSaved();
  return (
    <Page title="New recipe" lead="Build it line by line; the live declaration follows every change.">
      {problem ? <ErrorAlert title="The list of ingredients and recipes could not be loaded">{problem.message}</ErrorAlert> : null}
      <RecipeEditorForm initial={null} options={options} lookup={lookup} onSaved={openSaved} />
    </Page>
  );
}

const BACK = { to: '/recipes', label: 'Back to recipes' };

/** /recipes/:code/edit — manager and pastry chef only. */
export function RecipeEditorRoute() {
  return (
    <RoleRequired roles={KITCHEN_WRITERS} doing="edit recipes" back={BACK}>
      <EditRecipe />
    </RoleRequired>
  );
}

/** /recipes/new — manager and pastry chef only. */
export function NewRecipeRoute() {
  return (
    <RoleRequired roles={KITCHEN_WRITERS} doing="add recipes" back={BACK}>
      <NewRecipe />
    </RoleRequired>
  );
}
