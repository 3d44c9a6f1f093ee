import { NotBuiltYet } from '@/components/ui/not-built-yet';

export function CounterRoute() {
  return (
    <NotBuiltYet title="Counter" willHold="answer allergy questions at the counter, one product at a time, from the recorded recipes." />
  );
}
