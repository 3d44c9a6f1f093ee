import { render, screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { AppProviders } from '@/app/providers';
import { Mark, StatusMark, type AllergenStatus } from './status-mark';

const cases: { status: AllergenStatus; words: string; mark: string | null }[] = [
  { status: 'contains', words: 'Contains milk', mark: 'solid' },
  { status: 'may-contain', words: 'May contain milk', mark: 'striped' },
  { status: 'not-known', words: 'Not known milk', mark: 'dashed' },
  { status: 'none-recorded', words: 'None recorded milk', mark: null },
  { status: 'stated-none', words: 'Supplier states none milk', mark: null },
];

describe('StatusMark', () => {
  it.each(cases)('$status reads "$words" with a $mark mark', ({ status, words, mark }) => {
    const { container } = render(
      <AppProviders>
        <StatusMark status={status}>milk</StatusMark>
      </AppProviders>,
    );
    expect(container).toHaveTextContent(words);
    expect(screen.getByText('milk').tagName).toBe('STRONG');
    const shape = container.querySelector('[data-mark]');
    if (mark === null) {
      expect(shape).toBeNull();
    } else {
      expect(shape).toHaveAttribute('data-mark', mark);
      // The mark is decoration: the words carry the status for screen readers.
      expect(shape).toHaveAttribute('aria-hidden', 'true');
    }
  });

  it('gives the counter\'s "suitable as recorded" a ring of its own, hidden from screen readers', () => {
    const { container } = render(
      <AppProviders>
        <Mark status="suitable-as-recorded" />
      </AppProviders>,
    );
    const shape = container.querySelector('[data-mark]');
    expect(shape).toHaveAttribute('data-mark', 'ring');
    expect(shape).toHaveAttribute('aria-hidden', 'true');
  });
});
