import { NotBuiltYet } from '@/components/ui/not-built-yet';

export function AuditRoute() {
  return <NotBuiltYet title="Audit" willHold="show who changed which recipe, ingredient or declaration, and when." />;
}
