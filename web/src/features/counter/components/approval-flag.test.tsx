import { render, screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { AppProviders } from '@/app/providers';
import { ApprovalFlag, approvalSentence } from './approval-flag';

const stamp = { approvedAt: '2026-12-01T07:00:00.000Z', approvedBy: 'Maren Holloway' };

describe('the counter’s approval flag', () => {
  it('says nothing for an approved product', () => {
    expect(approvalSentence({ state: 'approved', ...stamp })).toBeNull();
  });

  it('says a change that adds an allergen or loses a claim is shown at once, not approved yet', () => {
    expect(
      approvalSentence({
        state: 'pending',
        ...stamp,
        serves: 'current',
        adds: [
          { allergen: 'eggs', label: 'eggs', how: 'contains', sources: ['egg'] },
          { allergen: 'nuts', label: 'nuts', how: 'may-contain', sources: ['hazelnut'] },
        ],
        losesClaims: ['egg-free'],
        notKnown: [],
      }),
    ).toBe('A change not approved yet adds eggs and nuts (hazelnut) and loses Egg-free: shown here now, as worked out after it.');
  });

  it('says a waiting change that adds nothing is shown as approved, and a product never approved as worked out now', () => {
    expect(approvalSentence({ state: 'pending', ...stamp, serves: 'approved', adds: [], losesClaims: [], notKnown: [] })).toMatch(
      /^A change waits for a manager’s approval; shown as approved on /,
    );
    render(
      <AppProviders>
        <ApprovalFlag approval={{ state: 'never-approved', serves: 'current' }} />
      </AppProviders>,
    );
    expect(screen.getByText('Not yet approved')).toBeInTheDocument();
    expect(screen.getByText('Shown as worked out now: a manager has not approved this declaration yet.')).toBeInTheDocument();
    expect(document.querySelector('[data-mark="diamond-dashed"]')).not.toBeNull();
  });
});
