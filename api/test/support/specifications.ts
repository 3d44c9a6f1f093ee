import type { SpecificationView } from '@crumbproof/shared';
import { fixture, multipart } from '../fixtures/forms';
import type { TestApp } from './test-app';

export const DAY = 86_400_000;

/** The kitchen's date `offset` days from now, as the API counts it (the server's calendar). */
export const isoDay = (offset: number, from = new Date()) => {
  const d = new Date(from.getTime() + offset * DAY);
  return `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}-${String(d.getDate()).padStart(2, '0')}`;
};

/** Uploads a supplier specification (a small PDF) of an ingredient as the signed-in `cookie`, expecting it kept. */
export async function uploadSpecification(t: TestApp, cookie: string, code: string, fields: Record<string, string>) {
  const form = await multipart(fields, { name: `${code}.pdf`, bytes: fixture('almond-paste-spec.pdf'), type: 'application/pdf' });
  const res = await t.app.inject({
    method: 'POST',
    url: `/api/ingredients/${code}/specifications`,
    payload: form.payload,
    headers: { ...form.headers, cookie },
  });
  expect(res.statusCode).toBe(201);
  return res.json<SpecificationView>();
}
