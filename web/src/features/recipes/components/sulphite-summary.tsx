import { Text } from '@chakra-ui/react';
import type { SulphiteGap, SulphiteResult } from '@crumbproof/shared';

const names = new Intl.ListFormat('en-GB', { style: 'long', type: 'conjunction' });

function mgPerKg(value: number): string {
  return `${value.toLocaleString('en-GB', { maximumFractionDigits: 2 })} mg/kg as eaten`;
}

/** "Sugar strands has" / "Sugar strands and Glacé cherries have". */
function whoHas(gaps: SulphiteGap[]): string {
  return `${names.format(gaps.map((gap) => gap.name))} ${gaps.length === 1 ? 'has' : 'have'}`;
}

/** Why each sulphite source's amount is not stated, e.g. "Dried apricots has no stated content". */
function unstatedWhy(gaps: SulphiteGap[]): string {
  const noFigure = gaps.filter((gap) => gap.reason === 'content-not-stated');
  const contact = gaps.filter((gap) => gap.reason === 'contact-line');
  return [
    noFigure.length > 0 ? `${whoHas(noFigure)} no stated content` : null,
    contact.length > 0 ? `${names.format(contact.map((gap) => gap.name))} only through a contact line, which has no weight` : null,
  ]
    .filter(Boolean)
    .join('; ');
}

/** The sulphite state of a declaration in words: declared, below the threshold, or not known and why. */
export function sulphiteWords(sulphites: SulphiteResult): string {
  const noStatement = sulphites.missing.filter((gap) => gap.reason === 'no-allergen-statement');
  const unstated = sulphites.missing.filter((gap) => gap.reason !== 'no-allergen-statement');
  switch (sulphites.status) {
    case 'declared':
      if (sulphites.mgPerKg !== null) return `Declared: ${mgPerKg(sulphites.mgPerKg)}, above the threshold.`;
      if (unstated.length > 0) return `Declared: contains sulphites, amount not stated (${unstatedWhy(unstated)}).`;
      return `Declared: the stated contents alone give ${mgPerKg(sulphites.statedMgPerKg)}, above the threshold; the total is not known (${whoHas(noStatement)} no allergen statement).`;
    case 'below-threshold':
      return `Below the threshold: ${mgPerKg(sulphites.mgPerKg ?? sulphites.statedMgPerKg)}, not declared.`;
    case 'not-known':
      return `Not known: ${whoHas(noStatement)} no allergen statement and no stated sulphite content, so the product cannot be shown to be below the threshold. Record ${noStatement.length === 1 ? 'its' : 'their'} allergen statement or sulphite content before labelling.`;
    default: {
      const never: never = sulphites.status;
      throw new Error(`Unknown sulphite status ${String(never)}`);
    }
  }
}

export function SulphiteSummary({ sulphites }: { sulphites: SulphiteResult }) {
  return (
    <Text data-testid="sulphites" data-sulphite-status={sulphites.status}>
      <Text as="span" fontWeight="bold">
        Sulphites:{' '}
      </Text>
      {sulphiteWords(sulphites)}
    </Text>
  );
}
