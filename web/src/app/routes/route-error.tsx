import { Box, Button, Code, Heading, Stack, Text } from '@chakra-ui/react';
import { isRouteErrorResponse, useRouteError } from 'react-router-dom';

function describe(error: unknown): { what: string; detail: string } {
  if (isRouteErrorResponse(error)) {
    return {
      what: `The page answered with status ${error.status}.`,
      detail: typeof error.data === 'string' && error.data !== '' ? error.data : error.statusText,
    };
  }
  if (error instanceof Error) {
    return { what: 'Part of this page stopped working while it was showing.', detail: error.message };
  }
  return { what: 'Part of this page stopped working while it was showing.', detail: String(error) };
}

/** Shown instead of a blank screen when a page throws: what happened, what to do, the message. */
export function RouteError() {
  const error = useRouteError();
  const { what, detail } = describe(error);

  return (
    <Box role="alert" maxW="3xl" mx="auto" px={{ base: '4', md: '8' }} py="8">
      <Stack gap="4">
        <Heading as="h1" size="2xl">
          Something went wrong on this page
        </Heading>
        <Text>
          {what} Nothing you saved has been lost. Reload the page to try again; if it happens again, tell your manager what you were doing
          and pass on the message below.
        </Text>
        <Code display="block" whiteSpace="pre-wrap" p="3" bg="bg.subtle" color="fg" rounded="md">
          {detail || 'No message was given.'}
        </Code>
        <Button alignSelf="flex-start" size="lg" onClick={() => window.location.reload()}>
          Reload
        </Button>
      </Stack>
    </Box>
  );
}
