import { Text } from '@chakra-ui/react';
import { Page } from './page';

interface NotBuiltYetProps {
  title: string;
  /** Completes "It will …": what the page will hold once it is built. */
  willHold: string;
}

/** A page that exists in the navigation but has no content yet, saying so plainly. */
export function NotBuiltYet({ title, willHold }: NotBuiltYetProps) {
  return (
    <Page title={title}>
      <Text maxW="65ch">This page is not built yet. It will {willHold}</Text>
    </Page>
  );
}
