import { Box } from '@chakra-ui/react';
import { useNavigation } from 'react-router-dom';
import { Loading } from '@/components/ui/loading';

/** The first page's code is on its way: shown in place of the app for that moment only. */
export function PageLoading() {
  return (
    <Box minH="100dvh" display="flex" alignItems="center" justifyContent="center" bg="bg.canvas" color="fg">
      <Loading size="lg">Opening Crumbproof…</Loading>
    </Box>
  );
}

/**
 * While the next page's code loads, the current page stays and a bar under the header says so,
 * so a click that takes a moment never looks ignored.
 */
export function NavigationProgress() {
  const navigation = useNavigation();
  if (navigation.state !== 'loading') return null;
  return (
    <Box position="sticky" top="0" zIndex="banner" bg="bg.panel" borderBottomWidth="1px" px="4" py="1">
      <Loading size="xs">Opening the page…</Loading>
    </Box>
  );
}
