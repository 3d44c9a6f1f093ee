import { Box, Text } from '@chakra-ui/react';
import { clockTime, notLiveMessage, type FreshnessState } from '../utils/freshness';

interface FreshnessBannerProps {
  state: FreshnessState;
  /** When the data on screen was computed (the last read that succeeded). */
  computedAt: string | undefined;
}

/** "Computed at HH:MM" while live; a banner that stays until a fresh read succeeds once the counter is not live. */
export function FreshnessBanner({ state, computedAt }: FreshnessBannerProps) {
  const message = notLiveMessage(state, computedAt);
  if (message) {
    return (
      <Box role="alert" borderWidth="2px" borderStyle="dashed" borderColor="fg" bg="bg.subtle" rounded="md" px="4" py="3">
        <Text fontSize="xl" fontWeight="bold">
          {message}
        </Text>
        <Text fontSize="md">Changes made in the kitchen since then are not shown. Ask the kitchen before answering from this screen.</Text>
      </Box>
    );
  }
  return computedAt ? (
    <Text role="status" fontSize="lg" color="fg.muted">
      Computed at {clockTime(computedAt)}
      {state.connection === 'open' ? '; live: changes in the kitchen show here as they are made.' : '.'}
    </Text>
  ) : null;
}
