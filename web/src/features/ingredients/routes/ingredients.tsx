import { NotBuiltYet } from '@/components/ui/not-built-yet';

export function IngredientsRoute() {
  return <NotBuiltYet title="Ingredients" willHold="list the kitchen’s ingredients with their supplier allergen statements, and let pastry chefs add and correct them." />;
}
