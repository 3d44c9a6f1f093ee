import { NotBuiltYet } from '@/components/ui/not-built-yet';

export function ApprovalsRoute() {
  return (
    <NotBuiltYet
      title="Approvals"
      willHold="hold recipe and ingredient changes waiting for a manager’s approval before they reach the counter."
    />
  );
}
