import { Box, Text } from '@chakra-ui/react';

/** The caution under every page: where declarations come from and who has the last word. */
export function CautionFooter() {
  return (
    <Box as="footer" borderTopWidth="1px" borderColor="border.muted" bg="bg.subtle" px={{ base: '4', md: '8' }} py="4">
      <Text maxW="6xl" mx="auto" fontSize="sm" color="fg.muted">
        Crumbproof computes declarations from the recipes and supplier information entered. Check them against supplier specifications;
        local law and your kitchen’s food-safety system decide.
      </Text>
    </Box>
  );
}
