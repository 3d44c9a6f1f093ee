import { Button, Stack } from '@chakra-ui/react';
import { ErrorAlert } from './error-alert';

interface LoadFailedProps {
  /** What could not be loaded: "The recipes could not be loaded". */
  title: string;
  error: Error;
  /** Read it again; left out where trying again cannot help (a page that does not exist). */
  onRetry?: () => void;
}

/** A read that failed: what failed, the API's own words, and a way to try again. */
export function LoadFailed({ title, error, onRetry }: LoadFailedProps) {
  return (
    <Stack gap="3">
      <ErrorAlert title={title}>{error.message}</ErrorAlert>
      {onRetry ? (
        <Button alignSelf="flex-start" size="lg" variant="outline" onClick={onRetry}>
          Try again
        </Button>
      ) : null}
    </Stack>
  );
}
