import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { fieldsRefused, LABEL_SETTINGS, mockApi, signedInAs } from '@/testing/mock-api';
import { renderApp } from '@/testing/render-app';

const SETTINGS = LABEL_SETTINGS;

/** Puts text into a box as a paste: typing it key by key is slow on a busy machine and tests nothing more here. */
async function replace(user: ReturnType<typeof renderApp>['user'], label: string, text: string) {
  await user.clear(screen.getByLabelText(label));
  await user.click(screen.getByLabelText(label));
  await user.paste(text);
}

describe('Label settings on the kitchen page (manager)', () => {
  it('shows the batch pattern with an example code, and saves the GS1 numbers with PUT', async () => {
    const { calls } = mockApi(
      signedInAs('manager', {
        'GET /api/labels/settings': { body: SETTINGS },
        'PUT /api/labels/settings': ({ body }) => ({ body }),
      }),
    );
    const { user } = renderApp('/kitchen');
    const form = await screen.findByRole('form', { name: 'Label settings' });
    expect(within(form).getByLabelText('Batch code pattern')).toHaveValue('{YY}{MM}{DD}-{P}-{N}');
    const today = new Date().toISOString().slice(0, 10);
    const code = `${today.slice(2, 4)}${today.slice(5, 7)}${today.slice(8, 10)}-LEMONT-1`;
    expect(within(form).getByText(code)).toBeInTheDocument();

    await replace(user, 'Batch code pattern', 'B{JJJ}{NN}');
    expect(within(form).getByText(`B${String(dayOfYear(today)).padStart(3, '0')}01`)).toBeInTheDocument();
    await user.click(within(form).getByLabelText('GS1 company prefix'));
    await user.paste('5069990');
    await user.selectOptions(within(form).getByLabelText('SSCC extension digit'), '4');
    await user.selectOptions(within(form).getByLabelText('Case indicator digit'), '2');
    await user.click(within(form).getByRole('button', { name: 'Save label settings' }));

    await waitFor(() => expect(calls.some((c) => c.method === 'PUT')).toBe(true));
    expect(calls.find((c) => c.method === 'PUT')?.body).toEqual({
      batchPattern: 'B{JJJ}{NN}',
      gs1CompanyPrefix: '5069990',
      ssccExtension: 4,
      caseIndicator: 2,
    });
    expect(await within(form).findByText(/Labels printed from now on follow these settings/)).toBeInTheDocument();
  });

  it('refuses a pattern without a sequence, and a company prefix that is not 6 to 12 digits, sending nothing', async () => {
    const { calls } = mockApi(signedInAs('manager', { 'GET /api/labels/settings': { body: SETTINGS } }));
    const { user } = renderApp('/kitchen');
    const form = await screen.findByRole('form', { name: 'Label settings' });
    await replace(user, 'Batch code pattern', '{YY}{MM}{DD}-{P}');
    expect(within(form).getByText(/Put a sequence token \(\{N\}, \{NN\} or \{NNN\}\) in the batch pattern/)).toBeInTheDocument();
    expect(within(form).getByLabelText('Batch code pattern')).toHaveAttribute('aria-invalid', 'true');

    await replace(user, 'Batch code pattern', '{YY}{MM}{DD}-{N}');
    await user.click(within(form).getByLabelText('GS1 company prefix'));
    await user.paste('50699');
    await user.click(within(form).getByRole('button', { name: 'Save label settings' }));
    expect(await within(form).findByText('A GS1 company prefix has 6 to 12 digits.')).toBeInTheDocument();
    expect(calls.some((c) => c.method === 'PUT')).toBe(false);
  });

  it('shows the API’s refusal beside the field and says nothing was saved', async () => {
    mockApi(
      signedInAs('manager', {
        'GET /api/labels/settings': { body: SETTINGS },
        'PUT /api/labels/settings': fieldsRefused({ gs1CompanyPrefix: 'The SSCC serials already given out do not fit after this prefix.' }),
      }),
    );
    const { user } = renderApp('/kitchen');
    const form = await screen.findByRole('form', { name: 'Label settings' });
    await user.click(within(form).getByRole('button', { name: 'Save label settings' }));
    const alert = await within(form).findByRole('alert');
    expect(within(alert).getByText(/Label settings not saved/)).toBeInTheDocument();
    expect(within(form).getAllByText(/do not fit after this prefix/).length).toBeGreaterThan(0);
  });
});

function dayOfYear(date: string): number {
  const [y, m, d] = date.split('-').map(Number) as [number, number, number];
  return Math.round((Date.UTC(y, m - 1, d) - Date.UTC(y, 0, 1)) / 86_400_000) + 1;
}
