import { describe, expect, it } from 'vitest';
import { declarationFor } from '../testing/fixtures';
import { wantedClaimNotices } from './wanted-claims';

const names: Record<string, { name: string; kind: 'recipe' | 'ingredient' }> = {
  'victoria-sponge': { name: 'Victoria sponge', kind: 'recipe' },
  'vanilla-sponge': { name: 'Vanilla sponge', kind: 'recipe' },
  'layer-1': { name: 'First layer', kind: 'recipe' },
  butter: { name: 'Butter', kind: 'ingredient' },
};
const lookup = (id: string) => names[id];

describe('wantedClaimNotices', () => {
  it('names the first path of a reason and counts its other paths through the same part', () => {
    const base = declarationFor();
    const declaration = {
      ...base,
      claims: {
        ...base.claims,
        vegan: {
          status: 'fails' as const,
          reasons: [
            {
              leaf: 'butter',
              path: ['victoria-sponge', 'vanilla-sponge', 'layer-1', 'butter'],
              message: 'Butter contains milk.',
              morePaths: 11,
            },
          ],
        },
      },
    };
    expect(wantedClaimNotices(['vegan'], declaration, lookup)).toEqual([
      'Vegan is wanted but fails: Butter (Vanilla sponge → First layer → Butter, and 11 other paths through Vanilla sponge) contains milk.',
    ]);
  });

  it('says nothing more of a reason given by one path', () => {
    expect(wantedClaimNotices(['vegan'], declarationFor(), lookup)).toEqual([
      'Vegan is wanted but fails: Butter (Vanilla sponge → Butter) contains milk.',
    ]);
  });
});
