import type { CounterQuestionView, CounterRules, Role } from '@crumbproof/shared';
import { render, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { AppProviders } from '@/app/providers';
import { createQueryClient } from '@/lib/query-client';
import { mockApi, type ApiHandlers } from '@/testing/mock-api';
import { renderAs } from '../testing/render-as';
import { useOpenQuestionCount } from '../api/questions';
import { avoidWords, QuestionsPanel } from './questions-panel';

const RULES: CounterRules = {
  groups: [
    { code: 'eggs', label: 'Eggs', sources: ['egg'] },
    { code: 'sesame', label: 'Sesame seeds', sources: ['sesame'] },
    { code: 'nuts', label: 'Nuts', sources: ['almond', 'hazelnut', 'walnut'] },
  ],
};

const OPEN_OLDER: CounterQuestionView = {
  id: 1,
  product: 'lemon-tart',
  productName: 'Lemon tart',
  avoid: ['eggs'],
  note: null,
  askedBy: 'Priya Sandhu',
  askedAt: '2026-12-02T09:05:00.000Z',
  answer: null,
};
const ANSWERED: CounterQuestionView = {
  id: 2,
  product: 'walnut-loaf',
  productName: 'Walnut loaf',
  avoid: ['walnut', 'sesame'],
  note: null,
  askedBy: 'Priya Sandhu',
  askedAt: '2026-12-02T09:30:00.000Z',
  answer: {
    text: 'The seeds on top are poppy; the tin is shared with the sesame bloomer.',
    by: 'Teodor Lind',
    at: '2026-12-02T09:40:00.000Z',
  },
};
const OPEN_NEWER: CounterQuestionView = {
  id: 3,
  product: 'seeded-bun',
  productName: 'Seeded bun',
  avoid: ['sesame', 'eggs', 'nuts'],
  note: 'Customer says a severe reaction last time.',
  askedBy: 'Ola Berg',
  askedAt: '2026-12-02T10:15:00.000Z',
  answer: null,
};
/** As the API sends them: newest first. */
const QUESTIONS = [OPEN_NEWER, ANSWERED, OPEN_OLDER];

function renderPanel(role: Role, handlers: ApiHandlers) {
  return renderAs(role, handlers, <QuestionsPanel rules={RULES} />);
}

const cards = () => screen.getAllByRole('article');

describe('QuestionsPanel', () => {
  it('lists the questions waiting for an answer first, then the answered, each newest first, in words', async () => {
    renderPanel('front-of-house', { 'GET /api/counter/questions': { body: QUESTIONS } });

    expect(await screen.findByRole('heading', { name: 'Questions for the kitchen' })).toBeInTheDocument();
    expect(screen.getByText('2 questions are waiting for an answer.')).toBeInTheDocument();
    expect(cards().map((card) => within(card).getByRole('heading').textContent)).toEqual(['Seeded bun', 'Lemon tart', 'Walnut loaf']);

    const waiting = screen.getByRole('region', { name: 'Waiting for an answer' });
    expect(within(waiting).getAllByRole('article')).toHaveLength(2);
    const answered = screen.getByRole('region', { name: 'Answered' });
    expect(within(answered).getAllByRole('article')).toHaveLength(1);

    const bun = screen.getByRole('article', { name: 'Seeded bun' });
    // The regime's group labels, in bold as allergens are on the label, never the codes.
    expect(bun).toHaveTextContent('Avoids Sesame seeds, Eggs and Nuts');
    expect(within(bun).getByText('Sesame seeds').tagName).toBe('STRONG');
    expect(bun).toHaveTextContent('Asked by Ola Berg');
    expect(bun).toHaveTextContent('Note: Customer says a severe reaction last time.');
    expect(bun).toHaveTextContent('Waiting for the kitchen’s answer.');
    // Front of house reads; only the kitchen answers.
    expect(within(bun).queryByRole('textbox')).not.toBeInTheDocument();

    const loaf = screen.getByRole('article', { name: 'Walnut loaf' });
    // A single source is named as the source.
    expect(loaf).toHaveTextContent('Avoids walnut and Sesame seeds');
    expect(loaf).toHaveTextContent('The kitchen’s answer');
    expect(loaf).toHaveTextContent('The seeds on top are poppy; the tin is shared with the sesame bloomer.');
    expect(loaf).toHaveTextContent('Teodor Lind');
  });

  it('lets the pastry chef answer, sends the text and shows the answer once the list is read again', async () => {
    let questions = QUESTIONS;
    const { calls, user } = renderPanel('pastry-chef', {
      'GET /api/counter/questions': () => ({ body: questions }),
      'POST /api/counter/questions/3/answer': ({ body }) => {
        const answered = {
          ...OPEN_NEWER,
          answer: { text: (body as { answer: string }).answer, by: 'Teodor Lind', at: '2026-12-02T10:20:00.000Z' },
        };
        questions = questions.map((q) => (q.id === 3 ? answered : q));
        return { body: answered };
      },
    });

    const bun = await screen.findByRole('article', { name: 'Seeded bun' });
    // Answered questions have no form.
    expect(within(screen.getByRole('article', { name: 'Walnut loaf' })).queryByRole('textbox')).not.toBeInTheDocument();
    await user.type(within(bun).getByLabelText('Answer for the counter'), '  The bun has sesame on top: not for this customer.  ');
    await user.click(within(bun).getByRole('button', { name: 'Send the answer' }));

    await waitFor(() => expect(screen.getByText('1 question is waiting for an answer.')).toBeInTheDocument());
    const answered = within(screen.getByRole('region', { name: 'Answered' })).getByRole('article', { name: 'Seeded bun' });
    expect(answered).toHaveTextContent('The bun has sesame on top: not for this customer.');
    expect(calls.filter((c) => c.method === 'POST').map((c) => c.body)).toEqual([
      { answer: 'The bun has sesame on top: not for this customer.' },
    ]);
  });

  it('refuses an empty answer before sending, with the reason beside the box', async () => {
    const { calls, user } = renderPanel('manager', { 'GET /api/counter/questions': { body: QUESTIONS } });

    const tart = await screen.findByRole('article', { name: 'Lemon tart' });
    await user.type(within(tart).getByLabelText('Answer for the counter'), '   ');
    await user.click(within(tart).getByRole('button', { name: 'Send the answer' }));

    expect(await within(tart).findByText('Write the answer for the counter.')).toBeInTheDocument();
    expect(within(tart).getByLabelText('Answer for the counter')).toHaveAttribute('aria-invalid', 'true');
    expect(calls.some((c) => c.method === 'POST')).toBe(false);
  });

  it('says so when someone else answered first, and reads the list again', async () => {
    let reads = 0;
    const message = 'This question was answered already, by Maren Okafor at 2026-12-02T10:16:00.000Z.';
    const { user } = renderPanel('pastry-chef', {
      'GET /api/counter/questions': () => {
        reads += 1;
        return { body: QUESTIONS };
      },
      'POST /api/counter/questions/1/answer': {
        status: 409,
        body: { statusCode: 409, code: 'conflict', message, fields: [{ path: 'answer', message }] },
      },
    });

    const tart = await screen.findByRole('article', { name: 'Lemon tart' });
    await user.type(within(tart).getByLabelText('Answer for the counter'), 'No egg in the pastry.');
    await user.click(within(tart).getByRole('button', { name: 'Send the answer' }));

    expect(await within(tart).findByRole('alert')).toHaveTextContent(message);
    await waitFor(() => expect(reads).toBe(2));
  });

  it('says when no question has been asked, and when the list could not be read', async () => {
    renderPanel('manager', { 'GET /api/counter/questions': { body: [] } });
    expect(await screen.findByText(/No questions have been asked yet/)).toBeInTheDocument();
    expect(screen.queryByRole('article')).not.toBeInTheDocument();
  });

  it('shows the API’s words when the questions cannot be loaded, with a way to try again', async () => {
    renderPanel('manager', {
      'GET /api/counter/questions': { status: 503, body: { statusCode: 503, code: 'internal', message: 'The database is not answering.' } },
    });
    expect(await screen.findByRole('alert')).toHaveTextContent('The database is not answering.');
    expect(screen.getByRole('button', { name: 'Try again' })).toBeInTheDocument();
  });
});

describe('useOpenQuestionCount', () => {
  function Count() {
    const count = useOpenQuestionCount();
    return <p>{count === undefined ? 'not read' : `${count} open`}</p>;
  }

  it('counts the questions with no answer from the same list', async () => {
    mockApi({ 'GET /api/counter/questions': { body: QUESTIONS } });
    const queryClient = createQueryClient();
    queryClient.setDefaultOptions({ queries: { retry: false } });
    render(
      <AppProviders queryClient={queryClient}>
        <Count />
      </AppProviders>,
    );
    expect(screen.getByText('not read')).toBeInTheDocument();
    expect(await screen.findByText('2 open')).toBeInTheDocument();
  });
});

describe('avoidWords', () => {
  it.each([
    { code: 'eggs', words: 'Eggs' },
    { code: 'walnut', words: 'walnut' },
    { code: 'brazil-nut', words: 'Brazil nut' },
    { code: 'tree-nuts', words: 'tree nuts' },
  ])('says $code as "$words"', ({ code, words }) => {
    expect(avoidWords(code, RULES)).toBe(words);
  });
});
