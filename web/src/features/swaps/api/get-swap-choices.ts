import { useQuery } from '@tanstack/react-query';
import { getIngredientsQueryOptions } from '@/api/ingredients';
import { getRecipesQueryOptions } from '@/api/recipes';

/** The swap check picks from every recipe and ingredient: the same cached lists the other pages read. */
export function useSwapChoices() {
  const recipes = useQuery(getRecipesQueryOptions());
  const ingredients = useQuery(getIngredientsQueryOptions());
  return { recipes, ingredients };
}
