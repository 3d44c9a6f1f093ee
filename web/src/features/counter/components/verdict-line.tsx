import { HStack, Text } from '@chakra-ui/react';
import type { CounterVerdict } from '@crumbproof/shared';
import { Mark } from '@/components/ui/status-mark';

export const VERDICT_WORDS: Record<CounterVerdict, string> = {
  'suitable-as-recorded': 'Suitable as recorded',
  'may-contain': 'May contain',
  'not-known': 'Not known',
  contains: 'Contains',
};

interface VerdictLineProps {
  verdict: CounterVerdict;
  size?: 'md' | 'lg';
}

/** The verdict in words first, its mark beside them: contains solid, may contain striped, not known dashed, suitable a ring. */
export function VerdictLine({ verdict, size = 'md' }: VerdictLineProps) {
  return (
    <HStack as="span" display="inline-flex" gap="2" align="center" fontSize={size === 'lg' ? '2xl' : 'xl'} fontWeight="bold">
      <Mark status={verdict} />
      <Text as="span">{VERDICT_WORDS[verdict]}</Text>
    </HStack>
  );
}
