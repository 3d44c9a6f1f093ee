import { Box, Button, Heading, HStack, Stack, Text, Wrap } from '@chakra-ui/react';
import { COUNTER_WANTS, SOURCE_LABELS, type CounterGroup, type CounterRules, type CounterWant } from '@crumbproof/shared';
import { useId, useState, type ReactNode } from 'react';
import { isEmptyAsk, listed, type CounterAsk } from '../utils/lookup';

const WANT_LABELS: Record<CounterWant, string> = { vegan: 'Vegan', vegetarian: 'Vegetarian' };

const capitalised = (text: string) => text.charAt(0).toUpperCase() + text.slice(1);

/** Picking a group drops any of its sources picked alone; picking a source drops its group. */
export function toggleAvoid(ask: CounterAsk, code: string, rules: CounterRules): CounterAsk {
  if (ask.avoid.includes(code)) return { ...ask, avoid: ask.avoid.filter((c) => c !== code) };
  const group = rules.groups.find((g) => g.code === code);
  const others = group
    ? ask.avoid.filter((c) => !(group.sources as readonly string[]).includes(c))
    : ask.avoid.filter(
        (c) => !rules.groups.some((g) => g.code === c && g.sources.length > 1 && (g.sources as readonly string[]).includes(code)),
      );
  return { ...ask, avoid: [...others, code] };
}

export function toggleWant(ask: CounterAsk, want: CounterWant): CounterAsk {
  return { ...ask, want: ask.want.includes(want) ? ask.want.filter((w) => w !== want) : [...ask.want, want] };
}

interface ChipProps {
  pressed: boolean;
  onToggle: () => void;
  children: ReactNode;
  size?: 'md' | 'lg';
}

/** A large toggle in words: pressed is filled with a tick, not pressed is an outline. */
function Chip({ pressed, onToggle, children, size = 'lg' }: ChipProps) {
  return (
    <Button
      type="button"
      aria-pressed={pressed}
      onClick={onToggle}
      minH={size === 'lg' ? '12' : '11'}
      px="4"
      fontSize={size === 'lg' ? 'xl' : 'lg'}
      fontWeight={pressed ? 'bold' : 'normal'}
      rounded="full"
      variant={pressed ? 'solid' : 'outline'}
      bg={pressed ? 'accent.solid' : 'bg.panel'}
      color={pressed ? 'accent.contrast' : 'fg'}
      borderColor={pressed ? 'accent.solid' : 'border'}
      borderWidth="2px"
      whiteSpace="normal"
      textAlign="start"
      h="auto"
      py="2"
    >
      {pressed ? (
        <Text as="span" aria-hidden="true">
          ✓
        </Text>
      ) : null}
      {children}
    </Button>
  );
}

interface GroupChipProps {
  group: CounterGroup;
  ask: CounterAsk;
  onToggle: (code: string) => void;
}

/** A group chip; a group of several sources (gluten cereals, nuts) opens to pick one of them instead. */
function GroupChip({ group, ask, onToggle }: GroupChipProps) {
  const sourcesId = useId();
  const pickedSources = group.sources.filter((s) => ask.avoid.includes(s));
  const [open, setOpen] = useState(pickedSources.length > 0);
  const picked = pickedSources.length > 0 ? `Only ${listed(pickedSources.map((s) => SOURCE_LABELS[s]))}` : null;
  const label = capitalised(group.label);
  if (group.sources.length <= 1) {
    return (
      <Chip pressed={ask.avoid.includes(group.code)} onToggle={() => onToggle(group.code)}>
        {label}
      </Chip>
    );
  }
  return (
    <Box display="contents">
      <HStack gap="0" align="stretch">
        <Chip pressed={ask.avoid.includes(group.code)} onToggle={() => onToggle(group.code)}>
          {label}
        </Chip>
        <Button
          type="button"
          variant="ghost"
          minH="12"
          px="3"
          fontSize="lg"
          color="accent.fg"
          textDecoration="underline"
          aria-expanded={open}
          aria-controls={sourcesId}
          // The visible words begin the name, so a person who says what they see reaches it.
          aria-label={picked ? `${picked}: change which of the ${group.label}` : `Pick one of the ${group.label}`}
          onClick={() => setOpen((o) => !o)}
        >
          {picked ?? 'Pick one'}
        </Button>
      </HStack>
      {open ? (
        <Box
          id={sourcesId}
          role="group"
          aria-label={`One of the ${group.label}`}
          w="full"
          ps="4"
          borderStartWidth="3px"
          borderColor="accent.muted"
        >
          <Wrap gap="2">
            {group.sources.map((source) => (
              <Chip key={source} size="md" pressed={ask.avoid.includes(source)} onToggle={() => onToggle(source)}>
                {SOURCE_LABELS[source]}
              </Chip>
            ))}
          </Wrap>
        </Box>
      ) : null}
    </Box>
  );
}

interface AvoidPickerProps {
  rules: CounterRules;
  ask: CounterAsk;
  onChange: (ask: CounterAsk) => void;
}

/** What the customer must avoid (the regime's groups, or one source of a group) and what they want, as large chips in words. */
export function AvoidPicker({ rules, ask, onChange }: AvoidPickerProps) {
  const avoidsId = useId();
  const wantsId = useId();
  return (
    <Stack gap="4">
      <Stack gap="2" role="group" aria-labelledby={avoidsId}>
        <Heading as="h2" id={avoidsId} fontSize="xl">
          The customer avoids
        </Heading>
        <Wrap gap="2" align="center">
          {rules.groups.map((group) => (
            <GroupChip key={group.code} group={group} ask={ask} onToggle={(code) => onChange(toggleAvoid(ask, code, rules))} />
          ))}
        </Wrap>
      </Stack>
      <Stack gap="2" role="group" aria-labelledby={wantsId}>
        <Heading as="h2" id={wantsId} fontSize="xl">
          The customer wants
        </Heading>
        <Wrap gap="2" align="center">
          {COUNTER_WANTS.map((want) => (
            <Chip key={want} pressed={ask.want.includes(want)} onToggle={() => onChange(toggleWant(ask, want))}>
              {WANT_LABELS[want]}
            </Chip>
          ))}
          <Button
            type="button"
            variant="ghost"
            minH="12"
            px="5"
            fontSize="xl"
            color="accent.fg"
            textDecoration="underline"
            disabled={isEmptyAsk(ask)}
            onClick={() => onChange({ avoid: [], want: [] })}
          >
            Clear every pick
          </Button>
        </Wrap>
      </Stack>
    </Stack>
  );
}
