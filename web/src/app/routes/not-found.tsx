import { Link, Text } from '@chakra-ui/react';
import { Link as RouterLink, useLocation } from 'react-router-dom';
import { Page } from '@/components/ui/page';

export function NotFoundRoute() {
  const location = useLocation();
  return (
    <Page title="Page not found">
      <Text maxW="65ch">
        There is no page at <Text as="code">{location.pathname}</Text>. The address may be mistyped, or the page may have moved.
      </Text>
      <Link asChild color="accent.fg" fontWeight="bold" alignSelf="flex-start" minH="11">
        <RouterLink to="/">Go to the home page</RouterLink>
      </Link>
    </Page>
  );
}
