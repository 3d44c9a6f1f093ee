import { Box, Button, Link, Text } from '@chakra-ui/react';
import type { ClaimReason } from '@crumbproof/shared';
import { Fragment, useState } from 'react';
import { Link as RouterLink } from 'react-router-dom';
import { layerSteps, pathsCount, useCanOpenPath, type ItemLookup } from './layer-path';

interface InlinePathProps {
  path: readonly string[];
  lookup: ItemLookup;
}

/** A layer path on one line, for places where a stack would be too tall: "Cake → Sponge → Butter". */
export function InlinePath({ path, lookup }: InlinePathProps) {
  const steps = layerSteps(path, lookup);
  const canOpen = useCanOpenPath();
  return (
    <Text as="span" color="fg.muted" textStyle="sm">
      {steps.map((step, index) => (
        <Fragment key={`${step.id}-${index}`}>
          {index > 0 ? <span aria-hidden="true"> → </span> : null}
          {index > 0 ? (
            <Box as="span" srOnly>
              then
            </Box>
          ) : null}
          {canOpen(step.href) ? (
            <Link asChild color="accent.fg">
              <RouterLink to={step.href}>{step.name}</RouterLink>
            </Link>
          ) : (
            <span>{step.name}</span>
          )}
        </Fragment>
      ))}
    </Text>
  );
}

interface ClaimReasonListProps {
  reasons: readonly ClaimReason[];
  lookup: ItemLookup;
}

/** The place a reason's paths go through: the line of the product's own recipe (its second id). */
const placeName = (path: readonly string[], lookup: ItemLookup) => lookup(path[1] ?? '')?.name ?? path[1] ?? '';

/** Reasons shown before "Show N more reasons". */
const FIRST_REASONS = 3;

/** Every leaf (or the kitchen's own handling) that stops a claim, with where it sits in the product. */
export function ClaimReasonList({ reasons, lookup }: ClaimReasonListProps) {
  const [all, setAll] = useState(false);
  if (reasons.length === 0) return null;
  const shown = all ? reasons : reasons.slice(0, FIRST_REASONS);
  const hidden = reasons.length - shown.length;
  return (
    <Box as="ul" ps="5" m="0" display="flex" flexDirection="column" gap="1">
      {shown.map((reason, index) => (
        <Box as="li" key={`${reason.leaf ?? 'kitchen'}-${index}`}>
          <Text as="span">{reason.message}</Text>
          {reason.path.length > 1 ? (
            <>
              {' '}
              <Text as="span" color="fg.muted" textStyle="sm">
                (via{' '}
              </Text>
              <InlinePath path={reason.path} lookup={lookup} />
              <Text as="span" color="fg.muted" textStyle="sm">
                {reason.morePaths ? `, and by ${pathsCount(reason.morePaths, 'other')} through ${placeName(reason.path, lookup)}` : ''})
              </Text>
            </>
          ) : null}
        </Box>
      ))}
      {hidden > 0 ? (
        <Box as="li" listStyleType="none">
          <Button variant="plain" size="sm" px="0" color="accent.fg" textDecoration="underline" onClick={() => setAll(true)}>
            Show {hidden} more reason{hidden === 1 ? '' : 's'}
          </Button>
        </Box>
      ) : null}
    </Box>
  );
}
