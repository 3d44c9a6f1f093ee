import { NotBuiltYet } from '@/components/ui/not-built-yet';

export function RecipesRoute() {
  return <NotBuiltYet title="Recipes" willHold="list recipes and sub-recipes with the allergen and dietary declaration each one rolls up to." />;
}
