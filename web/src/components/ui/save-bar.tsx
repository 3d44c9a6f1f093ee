import { Button, HStack, Text } from '@chakra-ui/react';

/** A settings form's submit button and the status line beside it that says when it was saved. */
export function SaveBar({ label, pending, status }: { label: string; pending: boolean; status: string | null }) {
  return (
    <HStack gap="4" wrap="wrap">
      <Button type="submit" size="lg" loading={pending} loadingText="Saving…">
        {label}
      </Button>
      <Text role="status" color="fg.muted">
        {status}
      </Text>
    </HStack>
  );
}
