import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { useState } from 'react';
import { describe, expect, it } from 'vitest';
import { AppProviders } from '@/app/providers';
import { DEMO_RULES } from '../testing/counter-view';
import { EMPTY_ASK, type CounterAsk } from '../utils/lookup';
import { AvoidPicker, toggleAvoid, toggleWant } from './avoid-picker';

describe('toggleAvoid', () => {
  it.each<{ title: string; from: string[]; code: string; expected: string[] }>([
    { title: 'picks a group', from: [], code: 'eggs', expected: ['eggs'] },
    { title: 'unpicks a group', from: ['eggs', 'milk'], code: 'eggs', expected: ['milk'] },
    { title: 'one nut replaces the whole group', from: ['nuts', 'eggs'], code: 'walnut', expected: ['eggs', 'walnut'] },
    { title: 'the group replaces the nuts picked alone', from: ['walnut', 'eggs', 'pecan'], code: 'nuts', expected: ['eggs', 'nuts'] },
    { title: 'a second nut joins the first', from: ['walnut'], code: 'pecan', expected: ['walnut', 'pecan'] },
    { title: 'one cereal replaces gluten', from: ['gluten'], code: 'spelt', expected: ['spelt'] },
  ])('$title', ({ from, code, expected }) => {
    expect(toggleAvoid({ avoid: from, want: [] }, code, DEMO_RULES).avoid).toEqual(expected);
  });

  it('toggles a want and leaves the avoided alone', () => {
    const ask = toggleWant({ avoid: ['eggs'], want: [] }, 'vegan');
    expect(ask).toEqual({ avoid: ['eggs'], want: ['vegan'] });
    expect(toggleWant(ask, 'vegan')).toEqual({ avoid: ['eggs'], want: [] });
  });
});

function Picker({ onAsk }: { onAsk: (ask: CounterAsk) => void }) {
  const [ask, setAsk] = useState<CounterAsk>(EMPTY_ASK);
  return (
    <AppProviders>
      <AvoidPicker
        rules={DEMO_RULES}
        ask={ask}
        onChange={(next) => {
          setAsk(next);
          onAsk(next);
        }}
      />
    </AppProviders>
  );
}

describe('AvoidPicker', () => {
  it('offers every group of the regime in words, as toggles, and wants vegan and vegetarian', () => {
    render(<Picker onAsk={() => {}} />);
    const avoids = screen.getByRole('group', { name: 'The customer avoids' });
    const chips = within(avoids)
      .getAllByRole('button')
      .filter((b) => b.hasAttribute('aria-pressed'))
      .map((b) => b.textContent);
    expect(chips).toEqual(DEMO_RULES.groups.map((g) => g.label.charAt(0).toUpperCase() + g.label.slice(1)));
    const wants = screen.getByRole('group', { name: 'The customer wants' });
    expect(within(wants).getByRole('button', { name: 'Vegan' })).toHaveAttribute('aria-pressed', 'false');
    expect(within(wants).getByRole('button', { name: 'Vegetarian' })).toHaveAttribute('aria-pressed', 'false');
    expect(screen.getByRole('button', { name: 'Clear every pick' })).toBeDisabled();
  });

  it('opens a group of several sources to pick one, says which is picked, and clears everything', async () => {
    const user = userEvent.setup();
    let last: CounterAsk = EMPTY_ASK;
    render(<Picker onAsk={(ask) => (last = ask)} />);
    // Only the groups of several sources open.
    expect(screen.queryByRole('button', { name: 'Pick one of the eggs' })).toBeNull();
    const open = screen.getByRole('button', { name: 'Pick one of the cereals containing gluten' });
    expect(open).toHaveAttribute('aria-expanded', 'false');
    await user.click(open);
    expect(open).toHaveAttribute('aria-expanded', 'true');
    const cereals = screen.getByRole('group', { name: 'One of the cereals containing gluten' });
    expect(
      within(cereals)
        .getAllByRole('button')
        .map((b) => b.textContent),
    ).toEqual(['wheat', 'spelt', 'khorasan wheat', 'triticale', 'rye', 'barley', 'oats']);
    await user.click(within(cereals).getByRole('button', { name: 'oats' }));
    expect(last).toEqual({ avoid: ['oats'], want: [] });
    expect(screen.getByRole('button', { name: 'Only oats: change which of the cereals containing gluten' })).toHaveTextContent(
      /^Only oats$/,
    );
    await user.click(screen.getByRole('button', { name: 'Vegetarian' }));
    await user.click(screen.getByRole('button', { name: 'Clear every pick' }));
    expect(last).toEqual({ avoid: [], want: [] });
    expect(within(cereals).getByRole('button', { name: 'oats' })).toHaveAttribute('aria-pressed', 'false');
  });
});
