import { CLAIM_LABELS, type Claim, type Declaration } from '@crumbproof/shared';
import { pathsCount, type ItemLookup } from '@/components/ui/layer-path';

/**
 * "Vegan is wanted but fails: Butter (Vanilla sponge → Butter) contains milk." One sentence per
 * claim the sale details ask for that the declaration does not hold, naming every reason.
 */
export function wantedClaimNotices(wanted: readonly Claim[], declaration: Declaration, lookup: ItemLookup): string[] {
  const notices: string[] = [];
  for (const claim of wanted) {
    const result = declaration.claims[claim];
    if (!result || result.status === 'ok') continue;
    const verdict = result.status === 'fails' ? 'fails' : 'cannot be verified';
    const reasons = result.reasons.map((reason) => {
      const below = reason.path.slice(1).map((id) => lookup(id)?.name ?? id);
      const leafName = reason.leaf ? (lookup(reason.leaf)?.name ?? reason.leaf) : null;
      const message = reason.message.replace(/\.$/, '');
      if (below.length < 2) return message;
      const others = reason.morePaths ? `, and ${pathsCount(reason.morePaths, 'other')} through ${below[0]}` : '';
      const where = `(${below.join(' → ')}${others})`;
      if (leafName && message.startsWith(leafName)) return `${leafName} ${where}${message.slice(leafName.length)}`;
      return `${message} ${where}`;
    });
    notices.push(`${CLAIM_LABELS[claim]} is wanted but ${verdict}${reasons.length > 0 ? `: ${reasons.join('; ')}` : ''}.`);
  }
  return notices;
}
