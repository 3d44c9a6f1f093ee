import { Link, Text } from '@chakra-ui/react';
import { ROLE_LABELS, type Role } from '@crumbproof/shared';
import type { ReactNode } from 'react';
import { Link as RouterLink } from 'react-router-dom';
import { useSignedInUser } from '@/lib/signed-in-user';
import { Page } from './page';

interface RoleRequiredProps {
  roles: readonly Role[];
  /** Completes "Only … accounts can …": "edit recipes". */
  doing: string;
  /** Where the person can go instead, and what to call it. */
  back: { to: string; label: string };
  children: ReactNode;
}

function sentenceOf(roles: readonly Role[]): string {
  const labels = roles.map((role) => ROLE_LABELS[role]);
  if (labels.length <= 1) return labels.join('');
  return `${labels.slice(0, -1).join(', ')} and ${labels.at(-1)}`;
}

/**
 * For a part of a page the navigation map lets a role open but not use (the recipe editor
 * inside Recipes): the same refusal as the role gate, never the content itself.
 */
export function RoleRequired({ roles, doing, back, children }: RoleRequiredProps) {
  const me = useSignedInUser();
  if (roles.includes(me.role)) return children;
  return (
    <Page title="Not available to your role">
      <Text maxW="65ch">
        You are signed in as {ROLE_LABELS[me.role]}. Only {sentenceOf(roles)} accounts can {doing}. Ask your manager if you need it.
      </Text>
      <Link asChild color="accent.fg" fontWeight="bold" alignSelf="flex-start" minH="11">
        <RouterLink to={back.to}>{back.label}</RouterLink>
      </Link>
    </Page>
  );
}
