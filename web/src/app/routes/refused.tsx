import { Link, Text } from '@chakra-ui/react';
import { ROLE_LABELS, type Role } from '@crumbproof/shared';
import { Link as RouterLink } from 'react-router-dom';
import { Page } from '@/components/ui/page';
import { describeRoles, firstPathFor, PAGES, rolesThatCanOpen, type PageKey } from '../navigation';

interface RefusedRouteProps {
  page: PageKey;
  role: Role;
}

/** What a person sees on a page their role may not use: never the page itself. */
export function RefusedRoute({ page, role }: RefusedRouteProps) {
  const label = PAGES[page].label;
  return (
    <Page title="Not available to your role">
      <Text maxW="65ch">
        You are signed in as {ROLE_LABELS[role]}. Only {describeRoles(rolesThatCanOpen(page))} accounts can open {label}. Ask your manager
        if you need it.
      </Text>
      <Link asChild color="accent.fg" fontWeight="bold" alignSelf="flex-start" minH="11">
        <RouterLink to={firstPathFor(role)}>Go to your first page</RouterLink>
      </Link>
    </Page>
  );
}
