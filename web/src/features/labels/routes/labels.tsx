import { NotBuiltYet } from '@/components/ui/not-built-yet';

export function LabelsRoute() {
  return <NotBuiltYet title="Labels" willHold="prepare and print product labels with the ingredient list and allergens in bold." />;
}
