import { Box, Link, List } from '@chakra-ui/react';
import type { Role } from '@crumbproof/shared';
import { NavLink } from 'react-router-dom';
import { PAGES, pagesFor } from '../navigation';

interface MainNavProps {
  role: Role;
}

/** The pages this role may open, and only those: one line at tablet width too (tighter padding below 1024 px), wrapping only on narrower screens. */
export function MainNav({ role }: MainNavProps) {
  return (
    <Box as="nav" aria-label="Main" maxW="6xl" mx="auto" px={{ base: '2', md: '6' }}>
      <List.Root as="ul" listStyle="none" flexDirection="row" flexWrap="wrap" gap={{ base: '0', lg: '1' }}>
        {pagesFor(role).map((key) => (
          <List.Item key={key}>
            <Link
              asChild
              display="inline-flex"
              alignItems="center"
              minH="11"
              px={{ base: '2', lg: '3' }}
              color="fg"
              textDecoration="none"
              borderBottomWidth="3px"
              borderColor="transparent"
              _hover={{ bg: 'accent.subtle', textDecoration: 'none' }}
              _currentPage={{ borderColor: 'accent.solid', color: 'accent.fg', fontWeight: 'bold' }}
            >
              <NavLink to={PAGES[key].path}>{PAGES[key].label}</NavLink>
            </Link>
          </List.Item>
        ))}
      </List.Root>
    </Box>
  );
}
