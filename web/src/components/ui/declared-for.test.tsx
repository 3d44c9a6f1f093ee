import { render, screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { AppProviders } from '@/app/providers';
import { StandIns } from './declared-for';

describe('StandIns', () => {
  it('names each line the kitchen makes with its own ingredient, in words', () => {
    render(
      <AppProviders>
        <StandIns
          standIns={[
            {
              recipe: 'oat-batter',
              line: 2,
              replaces: 'plain-flour',
              replacesName: 'Plain flour',
              with: 'harbour-flour',
              withName: 'Stone-ground plain flour (Saltmarsh Mill)',
              note: 'From the mill on the quay',
            },
          ]}
          nameOf={(id) => (id === 'oat-batter' ? 'Oat-drink pancake batter' : id)}
        />
      </AppProviders>,
    );
    expect(screen.getByText('Made here with this kitchen’s own ingredients')).toBeInTheDocument();
    expect(
      screen.getByText(
        'Line 2 of Oat-drink pancake batter is made here with Stone-ground plain flour (Saltmarsh Mill) in place of Plain flour. From the mill on the quay.',
      ),
    ).toBeInTheDocument();
  });

  it('says nothing where the kitchen makes everything as the book says', () => {
    const { container } = render(
      <AppProviders>
        <StandIns standIns={undefined} nameOf={(id) => id} />
      </AppProviders>,
    );
    expect(container.textContent).toBe('');
  });
});
