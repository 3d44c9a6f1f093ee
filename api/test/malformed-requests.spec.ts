import { RequestMethod } from '@nestjs/common';
import { METHOD_METADATA, PATH_METADATA } from '@nestjs/common/constants';
import { DiscoveryService, MetadataScanner } from '@nestjs/core';
import { fixture, multipart } from './fixtures/forms';
import { tableChecksums } from './fixtures/table-checksums';
import { startTestApp, type TestApp } from './support/test-app';

/**
 * A corpus of malformed requests to every route that writes (POST, PUT, PATCH, DELETE): wrong
 * types, missing and unknown fields, numbers out of their physical range, huge strings and
 * bodies, deep nesting, odd Unicode, text that looks like SQL or HTML, ids that do not exist.
 * Each is refused with a 4xx whose message names the problem, none with a 500, and a checksum of
 * every table of the database (CHECKSUM TABLE) is the same after it as before.
 */

type Method = 'POST' | 'PUT' | 'PATCH' | 'DELETE';

interface Sent {
  payload?: string | Buffer;
  headers: Record<string, string>;
}

interface MalformedRequest {
  what: string;
  method: Method;
  url: string;
  /** The body as sent, with its content type. */
  send: () => Sent | Promise<Sent>;
  status: number;
  /** Found in the message, or in a field's path and message. */
  names: RegExp;
}

const reviewBy = new Date(Date.now() + 30 * 86_400_000).toISOString().slice(0, 10);

const ingredient = (over: Record<string, unknown> = {}): Record<string, unknown> => ({
  id: 'corpus-cream',
  name: 'Corpus cream',
  contains: ['milk'],
  mayContain: [],
  vegan: false,
  vegetarian: true,
  ...over,
});
const butter = (over: Record<string, unknown> = {}): Record<string, unknown> => ({
  id: 'butter',
  name: 'Butter',
  contains: ['milk'],
  mayContain: [],
  vegan: false,
  vegetarian: true,
  ...over,
});
const line = (over: Record<string, unknown> = {}) => ({ use: 'butter', qty: 100, unit: 'g', ...over });
const recipe = (over: Record<string, unknown> = {}): Record<string, unknown> => ({
  id: 'corpus-tart',
  name: 'Corpus tart',
  lines: [line()],
  sale: { portionG: 80 },
  ...over,
});
const recipeWithLine = (over: Record<string, unknown>) => recipe({ lines: [line(over)] });
const withNutrition = (nutrition: Record<string, unknown>) => ingredient({ nutrition });
const book = (over: Record<string, unknown> = {}): Record<string, unknown> => ({
  crumbproofBook: 1,
  site: { name: 'Wrenfield Lane Bakehouse', regime: 'UK', handles: [] },
  ingredients: [],
  recipes: [],
  ...over,
});
/** One site of a book given as sites. */
const corpusSite = (over: Record<string, unknown> = {}): Record<string, unknown> => ({
  id: 'corpus-shop',
  name: 'Corpus shop',
  regime: 'UK',
  handles: [],
  ...over,
});
const user = (over: Record<string, unknown> = {}) => ({
  email: 'corpus@example.com',
  name: 'Corpus Person',
  role: 'pastry-chef',
  password: 'a-long-pass-phrase-7',
  ...over,
});

const labelRun = (over: Record<string, unknown> = {}): Record<string, unknown> => ({
  template: 'product',
  items: [{ product: 'vegan-brownie', quantity: 2 }],
  productionDate: '2026-12-02',
  ...over,
});
const labelSettings = (over: Record<string, unknown> = {}): Record<string, unknown> => ({
  batchPattern: '{YY}{MM}{DD}-{P}-{N}',
  gs1CompanyPrefix: '9521234',
  ssccExtension: 0,
  caseIndicator: 1,
  ...over,
});

const counterDay = (over: Record<string, unknown> = {}): Record<string, unknown> => ({
  date: '2026-12-02',
  products: ['vegan-brownie', 'lemon-shortbread'],
  ...over,
});
const counterQuestion = (over: Record<string, unknown> = {}): Record<string, unknown> => ({
  product: 'vegan-brownie',
  avoid: ['eggs', 'walnut'],
  ...over,
});

const json = (body: unknown): Sent => ({ payload: JSON.stringify(body), headers: { 'content-type': 'application/json' } });
const raw = (payload: string | Buffer, type: string): Sent => ({ payload, headers: { 'content-type': type } });
const nothing = (): Sent => ({ headers: {} });
const form = async (fields: Record<string, string>, ...files: { field?: string; name: string; bytes: Buffer }[]): Promise<Sent> => {
  const encoded = await multipart(fields, ...files);
  return { payload: encoded.payload, headers: encoded.headers };
};
const csv = (text: string) => ({ name: 'ingredients.csv', bytes: Buffer.from(text, 'utf8') });
const pdf = () => ({ name: 'spec.pdf', bytes: fixture('almond-paste-spec.pdf') });
/** Nested arrays `depth` deep, as JSON text. */
const nested = (depth: number) => `${'['.repeat(depth)}${']'.repeat(depth)}`;
/** Stands for the nested lists in a body: JSON.stringify cannot write them that deep, JSON.parse can read them. */
const NESTED = '(nested lists)';
const jsonNested = (body: unknown, depth: number): Sent =>
  raw(JSON.stringify(body).replace(`"${NESTED}"`, nested(depth)), 'application/json');

/** An input hash of the right shape that is no declaration's. */
const HASH = 'ab'.repeat(32);

/** Each route that takes a JSON body, with a body it would take. */
const JSON_ROUTES: { method: Method; url: string; body: unknown }[] = [
  { method: 'POST', url: '/api/ingredients', body: ingredient() },
  { method: 'PUT', url: '/api/ingredients/butter', body: { ...butter(), baseRevision: 1 } },
  { method: 'POST', url: '/api/recipes', body: recipe() },
  { method: 'PUT', url: '/api/recipes/vanilla-sponge', body: { ...recipe({ id: 'vanilla-sponge' }), baseRevision: 1 } },
  { method: 'POST', url: '/api/swaps/preview', body: { from: 'butter', to: 'plant-spread' } },
  { method: 'POST', url: '/api/swaps/apply', body: { from: 'butter', to: 'plant-spread' } },
  { method: 'POST', url: '/api/book/import', body: book() },
  { method: 'PATCH', url: '/api/kitchen', body: { regime: 'EU' } },
  { method: 'POST', url: '/api/users', body: user() },
  { method: 'PATCH', url: '/api/users/2', body: { name: 'Renamed' } },
  { method: 'POST', url: '/api/users/invitations', body: { email: 'corpus-invite@example.com', name: 'Corpus', role: 'pastry-chef' } },
  { method: 'POST', url: '/api/auth/password-reset', body: { email: 'manager@example.com' } },
  { method: 'POST', url: '/api/auth/account-link', body: { token: 'A'.repeat(43) } },
  { method: 'POST', url: '/api/auth/set-password', body: { token: 'A'.repeat(43), password: 'a-long-pass-phrase-7' } },
  { method: 'POST', url: '/api/auth/sign-in', body: { email: 'manager@example.com', password: 'crumbproof-demo' } },
  {
    method: 'POST',
    url: '/api/auth/first-manager',
    body: { token: 'x', email: 'first@example.com', name: 'First', password: 'a-long-pass-phrase-7' },
  },
  { method: 'POST', url: '/api/composition/scan', body: { text: 'Wheat flour, butter (milk)' } },
  { method: 'POST', url: '/api/declarations/preview', body: recipe() },
  { method: 'POST', url: '/api/labels/runs', body: labelRun() },
  { method: 'PUT', url: '/api/labels/settings', body: labelSettings() },
  { method: 'PUT', url: '/api/counter/today', body: counterDay() },
  { method: 'POST', url: '/api/counter/questions', body: counterQuestion() },
  { method: 'POST', url: '/api/counter/questions/1/answer', body: { answer: 'It has no egg as recorded.' } },
  { method: 'PUT', url: '/api/public-page/settings', body: { enabled: true, baseUrl: 'https://menu.example.com' } },
  { method: 'POST', url: '/api/approvals', body: { products: [{ product: 'vegan-brownie', inputHash: HASH }] } },
  { method: 'POST', url: '/api/labels/stale/1-0/handled', body: { note: 'Withdrawn.' } },
];

/** What is wrong with a JSON body itself, tried on every JSON route. */
const BODY_BREAKAGES: { what: string; send: () => Sent; status: number; names: RegExp }[] = [
  { what: 'JSON cut off in the middle', send: () => raw('{"name": "Corpus', 'application/json'), status: 400, names: /not valid JSON/ },
  { what: 'JSON with single quotes', send: () => raw("{'name': 'Corpus'}", 'application/json'), status: 400, names: /not valid JSON/ },
  { what: 'a body that is a list', send: () => json([]), status: 400, names: /\(body\)|Give this part with its fields|fields/i },
  { what: 'a body that is a number', send: () => json(42), status: 400, names: /\(body\)|fields/i },
  { what: 'a body that is text', send: () => raw('text', 'text/plain'), status: 415, names: /application\/json/ },
];

/** Every route that takes an upload (multipart/form-data), with a form it would take. */
const UPLOAD_ROUTES: { url: string; good: () => Promise<Sent> }[] = [
  { url: '/api/ingredients/import/preview', good: () => form({}, { name: 'new.csv', bytes: fixture('new-ingredients.csv') }) },
  { url: '/api/ingredients/import', good: () => form({}, { name: 'new.csv', bytes: fixture('new-ingredients.csv') }) },
  { url: '/api/ingredients/butter/specifications', good: () => form({ reviewBy }, pdf()) },
];

const CORPUS: MalformedRequest[] = [
  ...JSON_ROUTES.flatMap((route) =>
    BODY_BREAKAGES.map((b) => ({ what: b.what, method: route.method, url: route.url, send: b.send, status: b.status, names: b.names })),
  ),
  ...JSON_ROUTES.map((route) => ({
    what: 'an unknown field at the top of the body',
    method: route.method,
    url: route.url,
    send: () => json({ ...(route.body as object), sneaky: true }),
    status: 400,
    names: /sneaky/,
  })),
  ...UPLOAD_ROUTES.flatMap((route): MalformedRequest[] => [
    {
      what: 'JSON sent where a form is taken',
      method: 'POST',
      url: route.url,
      send: () => json({ file: 'butter.pdf' }),
      status: 415,
      names: /multipart\/form-data/,
    },
    {
      what: 'a form without its boundary',
      method: 'POST',
      url: route.url,
      send: async () => ({ ...(await route.good()), headers: { 'content-type': 'multipart/form-data' } }),
      status: 400,
      names: /boundary/,
    },
    {
      what: 'a form cut off in the middle',
      method: 'POST',
      url: route.url,
      send: async () => {
        const good = await route.good();
        return { ...good, payload: (good.payload as Buffer).subarray(0, 200) };
      },
      status: 400,
      names: /could not be read/,
    },
    {
      what: 'a form without a file',
      method: 'POST',
      url: route.url,
      send: () => form(route.url.endsWith('specifications') ? { reviewBy } : {}),
      status: 400,
      names: /^file: .*(Attach|attach)/m,
    },
    {
      what: 'a file in a field other than file',
      method: 'POST',
      url: route.url,
      send: () => form({}, { field: 'upload', name: 'new.csv', bytes: fixture('new-ingredients.csv') }),
      status: 400,
      names: /in the field 'file', not 'upload'/,
    },
    {
      what: 'an unknown text field',
      method: 'POST',
      url: route.url,
      send: () => form({ reviewBy, sneaky: '1' }, { name: 'new.csv', bytes: fixture('new-ingredients.csv') }),
      status: 400,
      names: /no field 'sneaky'/,
    },
    {
      what: 'an empty file',
      method: 'POST',
      url: route.url,
      send: () => form(route.url.endsWith('specifications') ? { reviewBy } : {}, { name: 'empty.csv', bytes: Buffer.alloc(0) }),
      status: 400,
      names: /empty/i,
    },
  ]),

  // Ingredients: POST /api/ingredients
  ...(
    [
      ['no name', ingredient({ name: undefined }), /^name: /m],
      ['an empty name', ingredient({ name: '   ' }), /^name: Give the ingredient a name/m],
      ['a name that is a number', ingredient({ name: 5 }), /^name: Write this as text/m],
      ['a name of 10000 characters', ingredient({ name: 'n'.repeat(10_000) }), /^name: Keep this to 160 characters/m],
      ['a name with a lone surrogate', ingredient({ name: 'Corpus \ud83c cream' }), /^name: This text has a broken character/m],
      ['a name with a lone low surrogate', ingredient({ name: '\udc00Corpus' }), /^name: This text has a broken character/m],
      ['a name with NUL', ingredient({ name: 'Corpus\u0000cream' }), /^name: Leave out control characters/m],
      ['a name with an escape character', ingredient({ name: 'Corpus \u001b[31mcream' }), /^name: Leave out control characters/m],
      ['no vegan status', ingredient({ vegan: undefined }), /^vegan: Say whether it is vegan/m],
      ['a vegan status as text', ingredient({ vegan: 'yes' }), /^vegan: Say whether it is vegan/m],
      ['contains as a single text', ingredient({ contains: 'milk' }), /^contains: Write this as a list/m],
      ['an unknown allergen source', ingredient({ contains: ['chocolate'] }), /^contains\.0: Unknown allergen source 'chocolate'/m],
      [
        'an allergen that looks like SQL',
        ingredient({ contains: ["milk'); DROP TABLE ingredients;--"] }),
        /^contains\.0: Unknown allergen source 'milk'\); DROP TABLE/m,
      ],
      [
        'an allergen that looks like HTML',
        ingredient({ contains: ['<b>milk</b>'] }),
        /^contains\.0: Unknown allergen source '<b>milk<\/b>'/m,
      ],
      ['an allergen entry with an unknown field', ingredient({ contains: [{ source: 'milk', grams: 3 }] }), /remove grams/],

      ['a species of a lone surrogate', ingredient({ contains: [{ source: 'fish', species: '\ud800' }] }), /species|broken character/],
      ['may-contain as an object', ingredient({ mayContain: { milk: true } }), /^mayContain: Write this as a list/m],
      ['a composition of 4001 characters', ingredient({ composition: 'c'.repeat(4001) }), /^composition: Keep this to 4000 characters/m],
      ['a composition with NUL', ingredient({ composition: 'Flour\u0000, butter' }), /^composition: Leave out control characters/m],
      ['a supplier with a lone surrogate', ingredient({ supplier: 'Mill \udbff' }), /^supplier: This text has a broken character/m],
      ['a supplier of 161 characters', ingredient({ supplier: 's'.repeat(161) }), /^supplier: Keep this to 160 characters/m],
      ['a negative sulphite figure', ingredient({ sulphiteMgPerKg: -5 }), /^sulphiteMgPerKg: Use a number of at least 0/m],
      ['a sulphite figure of 1e9 mg/kg', ingredient({ sulphiteMgPerKg: 1e9 }), /^sulphiteMgPerKg: Use a number no larger than 100000/m],
      ['a gluten figure above a whole kilogram', ingredient({ glutenMgPerKg: 2e6 }), /^glutenMgPerKg: /m],
      ['zero grams per millilitre', ingredient({ gPerMl: 0 }), /^gPerMl: Use a number above zero/m],
      ['a negative density', ingredient({ gPerMl: -1 }), /^gPerMl: Use a number above zero/m],
      ['a density of 5e-324', ingredient({ gPerMl: 5e-324 }), /^gPerMl: Use at least 0\.01 g per ml/m],
      ['a density of 6 g per ml', ingredient({ gPerMl: 6 }), /^gPerMl: Use at most 5 g per ml/m],
      ['a weight each of 5e-324 g', ingredient({ gEach: 5e-324 }), /^gEach: Give a weight for one of at least 0\.001 g/m],
      ['a weight each of 200 kg', ingredient({ gEach: 200_000 }), /^gEach: Use at most 100000 g/m],
      ['a weight each as text', ingredient({ gEach: '50' }), /^gEach: Write a number/m],
      ['isWater as text', ingredient({ isWater: 'true' }), /^isWater: Write true or false/m],
      ['nutrition as a list', ingredient({ nutrition: [] }), /^nutrition: /m],
      ['a nutrition figure of 1e308 kJ', withNutrition({ energyKj: 1e308 }), /^nutrition\.energyKj: Use at most 3700 kJ per 100 g/m],
      ['energy of 901 kcal per 100 g', withNutrition({ energyKcal: 901 }), /^nutrition\.energyKcal: Use at most 900 kcal per 100 g/m],
      ['energy of 3701 kJ per 100 g', withNutrition({ energyKj: 3701 }), /^nutrition\.energyKj: Use at most 3700 kJ/m],
      ['negative energy', withNutrition({ energyKj: -1 }), /^nutrition\.energyKj: Use a number of at least 0/m],
      ['fat of 100.1 g per 100 g', withNutrition({ fat: 100.1 }), /^nutrition\.fat: Use a number no larger than 100/m],
      ['negative protein', withNutrition({ protein: -0.1 }), /^nutrition\.protein: Use a number of at least 0/m],
      ['salt of 1e308 g', withNutrition({ salt: 1e308 }), /^nutrition\.salt: Use a number no larger than 100/m],
      [
        'fat, carbohydrate and protein over 100 g',
        withNutrition({ fat: 40, carbohydrate: 40, protein: 30 }),
        /^nutrition\.protein: fat, carbohydrate and protein add up to 110 g/m,
      ],
      ['fibre and salt over 100 g with the rest', withNutrition({ fat: 50, fibre: 30, salt: 21 }), /add up to 101 g, more than the 100 g/],
      ['cholesterol above 100 g', withNutrition({ cholesterolMg: 100_001 }), /^nutrition\.cholesterolMg: Use at most 100000 mg/m],
      ['a nutrition figure as text', withNutrition({ sugars: 'ten' }), /^nutrition\.sugars: Write a number/m],
      ['an unknown nutrient', withNutrition({ vitaminQ: 3 }), /vitaminQ/],
      [
        'a nutrition source with a lone surrogate',
        withNutrition({ source: 'Label \ud834' }),
        /^nutrition\.source: This text has a broken character/m,
      ],
      ['an id that already exists', ingredient({ id: 'butter' }), /'butter' is already used/],
      ['an id that a recipe has', ingredient({ id: 'vanilla-sponge' }), /'vanilla-sponge' is already used/],
      ['an id in capitals', ingredient({ id: 'CORPUS-CREAM' }), /^id: Use lower-case letters, digits and hyphens, e\.g\. 'corpus-cream'/m],
      ['an id with an accent', ingredient({ id: 'corpus-crème' }), /^id: .*e\.g\. 'corpus-creme'/m],
      ['an id with a zero-width space', ingredient({ id: 'corpus\u200bcream' }), /^id: Use lower-case letters/m],
      ['an id in Cyrillic look-alike letters', ingredient({ id: 'соrpus-cream' }), /^id: Use lower-case letters/m],
      ['an id that is an emoji', ingredient({ id: '🍰' }), /^id: Use lower-case letters/m],
      ['an id with NUL', ingredient({ id: 'corpus\u0000' }), /^id: Use lower-case letters/m],
      ['an id that looks like SQL', ingredient({ id: "x' OR '1'='1" }), /^id: Use lower-case letters.*e\.g\. 'x-or-1-1'/m],
      [
        'an id that looks like HTML',
        ingredient({ id: '<script>alert(1)</script>' }),
        /^id: Use lower-case letters.*e\.g\. 'script-alert-1-script'/m,
      ],
      ['an id starting with a hyphen', ingredient({ id: '-corpus' }), /^id: Start the id with a letter or digit/m],
      ['an id of 81 characters', ingredient({ id: 'a'.repeat(81) }), /^id: Use an id of at most 80 characters/m],
      ['an empty id', ingredient({ id: '' }), /^id: An id cannot be empty/m],
      ['an id that is a number', ingredient({ id: 7 }), /^id: Write this as text/m],
    ] as const
  ).map(([what, body, names]) => ({
    what,
    method: 'POST' as const,
    url: '/api/ingredients',
    send: () => json(body),
    status: /already used/.test(names.source) ? 409 : 400,
    names,
  })),
  {
    what: 'a body over 2 MB',
    method: 'POST',
    url: '/api/ingredients',
    send: () => json(ingredient({ composition: 'x'.repeat(2_200_000) })),
    status: 413,
    names: /too large/,
  },
  {
    what: 'a body with no content',
    method: 'POST',
    url: '/api/ingredients',
    send: () => raw('', 'application/json'),
    status: 400,
    names: /Body cannot be empty/,
  },
  {
    what: 'allergens nested 10000 deep',
    method: 'POST',
    url: '/api/ingredients',
    send: () => jsonNested(ingredient({ contains: [NESTED] }), 10_000),
    status: 400,
    names: /^contains\.0: /m,
  },
  {
    what: 'a book nested 50000 deep',
    method: 'POST',
    url: '/api/book/import',
    send: () => jsonNested(book({ ingredients: [NESTED] }), 50_000),
    status: 400,
    names: /^ingredients\.0: /m,
  },
  {
    what: 'a body of 200000 nested lists',
    method: 'POST',
    url: '/api/ingredients',
    send: () => raw(nested(200_000), 'application/json'),
    status: 400,
    names: /^\(body\): Write this as a part with its fields/m,
  },
  {
    what: 'a body of 100000 nested objects',
    method: 'POST',
    url: '/api/ingredients',
    send: () => raw(`${'{"a":'.repeat(100_000)}1${'}'.repeat(100_000)}`, 'application/json'),
    status: 400,
    names: /There is no field 'a' here/,
  },

  // Ingredients: PUT /api/ingredients/:code
  {
    what: 'an ingredient that does not exist',
    method: 'PUT',
    url: '/api/ingredients/no-such-ingredient',
    send: () => json({ ...butter({ id: 'no-such-ingredient' }), baseRevision: 1 }),
    status: 404,
    names: /There is no ingredient 'no-such-ingredient'/,
  },
  {
    what: 'a body naming another ingredient',
    method: 'PUT',
    url: '/api/ingredients/butter',
    send: () => json({ ...butter({ id: 'caster-sugar' }), baseRevision: 1 }),
    status: 400,
    names: /does not match 'butter'/,
  },
  {
    what: 'an address in capitals',
    method: 'PUT',
    url: '/api/ingredients/BUTTER',
    send: () => json({ ...butter(), baseRevision: 1 }),
    status: 400,
    names: /^code: Use lower-case letters.*'butter'/m,
  },
  {
    what: 'an address that looks like SQL',
    method: 'PUT',
    url: `/api/ingredients/${encodeURIComponent("butter';DROP TABLE ingredients;--")}`,
    send: () => json({ ...butter(), baseRevision: 1 }),
    status: 400,
    names: /^code: Use lower-case letters/m,
  },
  {
    what: 'an address with an encoded NUL',
    method: 'PUT',
    url: '/api/ingredients/butter%00',
    send: () => json({ ...butter(), baseRevision: 1 }),
    status: 400,
    names: /^code: Use lower-case letters/m,
  },
  {
    what: 'a recipe id as the address',
    method: 'PUT',
    url: '/api/ingredients/vanilla-sponge',
    send: () => json({ ...butter({ id: 'vanilla-sponge' }), baseRevision: 1 }),
    status: 404,
    names: /There is no ingredient 'vanilla-sponge'/,
  },
  {
    what: 'no vegetarian status',
    method: 'PUT',
    url: '/api/ingredients/butter',
    send: () => json({ ...butter({ vegetarian: undefined }), baseRevision: 1 }),
    status: 400,
    names: /^vegetarian: Say whether it is vegetarian/m,
  },
  {
    what: 'a change that leaves recipes in ml unweighable',
    method: 'PUT',
    url: '/api/ingredients/whole-milk',
    send: () =>
      json({ id: 'whole-milk', name: 'Whole milk', contains: ['milk'], mayContain: [], vegan: false, vegetarian: true, baseRevision: 1 }),
    status: 400,
    names: /uses 'whole-milk' in 'ml', but Whole milk has no weight per millilitre/,
  },
  {
    what: 'a mass nutrient sum over 100 g',
    method: 'PUT',
    url: '/api/ingredients/butter',
    send: () => json({ ...butter({ nutrition: { fat: 82, protein: 19 } }), baseRevision: 1 }),
    status: 400,
    names: /^nutrition\.protein: fat and protein add up to 101 g/m,
  },
  // The revision the editor started from: required, a whole number from 1, and one that exists (both are at revision 1).
  ...(
    [
      ['no base revision', {}, /^baseRevision: Give baseRevision: the revision you started editing from/m],
      ['a base revision as text', { baseRevision: '1' }, /^baseRevision: Give baseRevision/m],
      ['a base revision of 0', { baseRevision: 0 }, /^baseRevision: Give baseRevision as a revision number from 1/m],
      ['a base revision of 1.5', { baseRevision: 1.5 }, /^baseRevision: Give baseRevision as a whole number/m],
      ['a base revision not yet saved', { baseRevision: 9 }, /has no revision 9: its current revision is 1/],
    ] as const
  ).flatMap(([what, base, names]): MalformedRequest[] => [
    { what, method: 'PUT', url: '/api/ingredients/butter', send: () => json({ ...butter(), ...base }), status: 400, names },
    {
      what,
      method: 'PUT',
      url: '/api/recipes/vanilla-sponge',
      send: () => json({ ...recipe({ id: 'vanilla-sponge' }), ...base }),
      status: 400,
      names,
    },
  ]),

  // Recipes: POST /api/recipes
  ...(
    [
      ['no lines', recipe({ lines: undefined }), /^lines: /m],
      ['an empty list of lines', recipe({ lines: [] }), /^lines: A recipe needs at least one line/m],
      ['lines as an object', recipe({ lines: { 0: line() } }), /^lines: Write this as a list/m],
      ['a quantity of zero', recipeWithLine({ qty: 0 }), /^lines\.0\.qty: Give a quantity above zero/m],
      ['a negative quantity', recipeWithLine({ qty: -100 }), /^lines\.0\.qty: Give a quantity above zero/m],
      ['a quantity of 5e-324 g', recipeWithLine({ qty: 5e-324 }), /^lines\.0\.qty: Use at least 0\.001 g/m],
      ['a quantity of half a milligram', recipeWithLine({ qty: 0.0005 }), /^lines\.0\.qty: Use at least 0\.001 g/m],
      ['a quantity of 5e-324 kg', recipeWithLine({ qty: 5e-324, unit: 'kg' }), /^lines\.0\.qty: Use at least 0\.000001 kg/m],
      ['a quantity of 2000 kg', recipeWithLine({ qty: 2000, unit: 'kg' }), /^lines\.0\.qty: Use at most 1000 kg/m],
      ['a quantity of 2000 litres', recipeWithLine({ qty: 2000, unit: 'l' }), /^lines\.0\.qty: Use at most 1000 l/m],
      ['a quantity of 300000 teaspoons', recipeWithLine({ qty: 300_000, unit: 'tsp' }), /^lines\.0\.qty: Use at most 200000 tsp/m],
      ['a quantity of 5000 cups', recipeWithLine({ qty: 5000, unit: 'cup' }), /^lines\.0\.qty: Use at most 4000 cup/m],
      ['a quantity of 2000000 g', recipeWithLine({ qty: 2_000_000 }), /^lines\.0\.qty: Use a quantity no larger than 1000000/m],
      ['a quantity of 1e308 each', recipeWithLine({ qty: 1e308, unit: 'each' }), /^lines\.0\.qty: Use a quantity no larger than 1000000/m],
      ['a quantity as text', recipeWithLine({ qty: '100' }), /^lines\.0\.qty: Give a quantity above zero/m],
      ['a quantity of null', recipeWithLine({ qty: null }), /^lines\.0\.qty: Give a quantity above zero/m],
      ['an unknown unit', recipeWithLine({ unit: 'pinch' }), /^lines\.0\.unit: /m],
      ['a unit that looks like SQL', recipeWithLine({ unit: 'g; DELETE FROM recipes' }), /^lines\.0\.unit: /m],
      ['an unknown line role', recipeWithLine({ role: 'garnish' }), /^lines\.0\.role: /m],
      ['a line with an unknown field', recipeWithLine({ note: 'softened' }), /note/],
      ['a line without what it uses', recipeWithLine({ use: undefined }), /^lines\.0\.use: /m],
      ['a line using an ingredient that does not exist', recipeWithLine({ use: 'no-such-ingredient' }), /no-such-ingredient/],
      ['a line using an id in capitals', recipeWithLine({ use: 'BUTTER' }), /^lines\.0\.use: Use lower-case letters.*'butter'/m],
      [
        'a line using an id that looks like HTML',
        recipeWithLine({ use: '<img src=x onerror=alert(1)>' }),
        /^lines\.0\.use: Use lower-case letters/m,
      ],
      [
        'a line in ml of an ingredient with no density',
        recipeWithLine({ unit: 'ml' }),
        /uses 'butter' in 'ml', but Unsalted butter has no weight per millilitre/,
      ],
      ['a recipe that contains itself', recipe({ lines: [line({ use: 'corpus-tart' })] }), /Corpus tart contains itself/],
      ['a portion of zero grams', recipe({ sale: { portionG: 0 } }), /^sale\.portionG: Give a portion weight above zero/m],
      [
        'a portion of 5e-324 g',
        recipe({ sale: { portionG: 5e-324 } }),
        /^sale\.portionG: Give a portion weight above zero: at least 0\.001 g/m,
      ],
      ['a portion of a tonne', recipe({ sale: { portionG: 1e6 } }), /^sale\.portionG: Use a portion weight no larger than 100000 g/m],
      ['a portion as text', recipe({ sale: { portionG: '80' } }), /^sale\.portionG: Give the weight of one portion in grams/m],
      ['an unknown claim', recipe({ sale: { portionG: 80, claims: ['kosher'] } }), /^sale\.claims\.0: /m],
      ['a claim that looks like HTML', recipe({ sale: { portionG: 80, claims: ['<svg/onload=alert(1)>'] } }), /^sale\.claims\.0: /m],
      ['a QUID of an ingredient not used', recipe({ sale: { portionG: 80, quid: ['no-such-ingredient'] } }), /no-such-ingredient/],
      ['a sale with an unknown field', recipe({ sale: { portionG: 80, price: 3.5 } }), /price/],
      ['a finished weight of zero', recipe({ finishedWeightG: 0 }), /^finishedWeightG: Give a finished weight above zero/m],
      ['a finished weight of 5e-324 g', recipe({ finishedWeightG: 5e-324 }), /^finishedWeightG: Give a finished weight above zero/m],
      [
        'a finished weight of 100 tonnes',
        recipe({ finishedWeightG: 1e8 }),
        /^finishedWeightG: Use a finished weight no larger than 10000000 g/m,
      ],
      [
        'a finished weight above what goes in',
        recipe({ finishedWeightG: 150 }),
        /^finishedWeightG: Corpus tart is given a finished weight of 150 g, more than the 100 g that goes into it/m,
      ],
      ['a recipe name with a lone surrogate', recipe({ name: 'Tart \udfff' }), /^name: This text has a broken character/m],
      ['a recipe name of 161 characters', recipe({ name: 't'.repeat(161) }), /^name: Keep this to 160 characters/m],
      ['a recipe id that an ingredient has', recipe({ id: 'butter' }), /'butter' is already used/],
      [
        'a recipe id with capitals that would contain itself',
        recipe({ id: 'CORPUS-TART', lines: [line({ use: 'corpus-tart' })] }),
        /^id: Use lower-case letters.*'corpus-tart'/m,
      ],
    ] as const
  ).map(([what, body, names]) => ({
    what,
    method: 'POST' as const,
    url: '/api/recipes',
    send: () => json(body),
    status: /already used/.test(names.source) ? 409 : 400,
    names,
  })),

  // Recipes: PUT /api/recipes/:code
  {
    what: 'a recipe that does not exist',
    method: 'PUT',
    url: '/api/recipes/no-such-recipe',
    send: () => json({ ...recipe({ id: 'no-such-recipe' }), baseRevision: 1 }),
    status: 404,
    names: /There is no recipe 'no-such-recipe'/,
  },
  {
    what: 'a body naming another recipe',
    method: 'PUT',
    url: '/api/recipes/vanilla-sponge',
    send: () => json({ ...recipe({ id: 'corpus-tart' }), baseRevision: 1 }),
    status: 400,
    names: /does not match 'vanilla-sponge'/,
  },
  {
    what: 'an address with an accent',
    method: 'PUT',
    url: `/api/recipes/${encodeURIComponent('vanilla-spongé')}`,
    send: () => json({ ...recipe({ id: 'vanilla-sponge' }), baseRevision: 1 }),
    status: 400,
    names: /^code: .*'vanilla-sponge'/m,
  },
  {
    what: 'an address of 200 characters',
    method: 'PUT',
    url: `/api/recipes/${'r'.repeat(200)}`,
    send: () => json({ ...recipe({ id: 'vanilla-sponge' }), baseRevision: 1 }),
    status: 414,
    names: /exceeding the max param length/,
  },
  {
    what: 'a recipe made to contain itself',
    method: 'PUT',
    url: '/api/recipes/vanilla-sponge',
    send: () => json({ ...recipe({ id: 'vanilla-sponge', lines: [line({ use: 'vanilla-sponge' })] }), baseRevision: 1 }),
    status: 400,
    names: /Corpus tart contains itself/,
  },
  {
    what: 'an ingredient id as the address',
    method: 'PUT',
    url: '/api/recipes/butter',
    send: () => json({ ...recipe({ id: 'butter' }), baseRevision: 1 }),
    status: 404,
    names: /There is no recipe 'butter'/,
  },

  // Swaps: POST /api/swaps/preview and /api/swaps/apply
  ...(['/api/swaps/preview', '/api/swaps/apply'] as const).flatMap((url): MalformedRequest[] =>
    (
      [
        ['nothing to replace', { to: 'plant-spread' }, 400, /^from: /m],
        ['no replacement', { from: 'butter' }, 400, /^to: /m],
        ['an empty replacement', { from: 'butter', to: '' }, 400, /^to: Choose the replacement/m],
        ['a replacement that is a number', { from: 'butter', to: 5 }, 400, /^to: Write this as text/m],
        ['an ingredient replaced by itself', { from: 'butter', to: 'butter' }, 400, /^to: Same as the ingredient replaced/m],
        [
          'an ingredient that does not exist',
          { from: 'no-such-ingredient', to: 'plant-spread' },
          404,
          /There is no ingredient or recipe 'no-such-ingredient'/,
        ],
        ['a replacement that does not exist', { from: 'butter', to: 'no-such-ingredient' }, 404, /'no-such-ingredient' to use instead/],
        [
          'a recipe that does not exist',
          { from: 'butter', to: 'plant-spread', recipe: 'no-such-recipe' },
          404,
          /There is no recipe 'no-such-recipe'/,
        ],
        [
          'an ingredient not used where asked',
          { from: 'yeast', to: 'plant-spread', recipe: 'vanilla-sponge' },
          400,
          /^from: Not used here/m,
        ],
        ['an id in capitals', { from: 'BUTTER', to: 'plant-spread' }, 400, /^from: Use lower-case letters.*'butter'/m],
        ['an id that looks like SQL', { from: "butter' --", to: 'plant-spread' }, 400, /^from: Use lower-case letters/m],
        ['an id that looks like HTML', { from: 'butter', to: '<iframe src=x>' }, 400, /^to: Use lower-case letters/m],
      ] as const
    ).map(([what, body, status, names]) => ({ what, method: 'POST', url, send: () => json(body), status, names })),
  ),

  // Book import: POST /api/book/import
  ...(
    [
      ['a book of an unknown version', book({ crumbproofBook: 2 }), /crumbproofBook must be 1/],
      ['a book without its site', book({ site: undefined }), /^site: /m],
      ['a site with an unknown regime', book({ site: { name: 'Wrenfield', regime: 'XX', handles: [] } }), /^site\.regime: /m],
      ['a site regime that looks like SQL', book({ site: { name: 'Wrenfield', regime: "UK' OR 1=1", handles: [] } }), /^site\.regime: /m],
      [
        'a site name with a lone surrogate',
        book({ site: { name: 'Wren\ud800', regime: 'UK', handles: [] } }),
        /^site\.name: This text has a broken character/m,
      ],
      ['ingredients as an object', book({ ingredients: {} }), /^ingredients: Write this as a list/m],
      [
        'an ingredient with a non-canonical id',
        book({ ingredients: [ingredient({ id: 'Corpus-Cream' })] }),
        /^ingredients\.0 \(Corpus-Cream\)\.id: Use lower-case letters.*'corpus-cream'/m,
      ],
      [
        'one id given to two ingredients',
        book({ ingredients: [ingredient(), ingredient({ contains: [] })] }),
        /The id 'corpus-cream' is used by the ingredient Corpus cream and by the ingredient Corpus cream/,
      ],
      [
        'one id given to an ingredient and a recipe',
        book({ ingredients: [ingredient({ id: 'corpus-tart' })], recipes: [recipe()] }),
        /The id 'corpus-tart' is used by/,
      ],
      [
        'a recipe using an id that does not exist',
        book({ recipes: [recipeWithLine({ use: 'no-such-ingredient' })] }),
        /no-such-ingredient/,
      ],
      [
        'a recipe that contains itself',
        book({ recipes: [recipe({ lines: [line({ use: 'corpus-tart' })] })] }),
        /Corpus tart contains itself/,
      ],
      [
        'a finished weight above what goes in',
        book({ ingredients: [ingredient()], recipes: [recipe({ lines: [line({ use: 'corpus-cream' })], finishedWeightG: 101 })] }),
        /^recipes\.0 \(corpus-tart\)\.finishedWeightG: Corpus tart is given a finished weight of 101 g, more than the 100 g/m,
      ],
      [
        'a nutrition figure of 1e308',
        book({ ingredients: [withNutrition({ energyKcal: 1e308 })] }),
        /nutrition\.energyKcal: Use at most 900 kcal/,
      ],
      ['a quantity of 5e-324 g', book({ recipes: [recipeWithLine({ qty: 5e-324 })] }), /lines\.0\.qty: Use at least 0\.001 g/],
      ['an unknown field in the site', book({ site: { name: 'Wrenfield', regime: 'UK', handles: [], owner: 'x' } }), /owner/],
      [
        'a handled allergen that does not exist',
        book({ site: { name: 'Wrenfield', regime: 'UK', handles: [{ allergen: 'gluten', controls: 'segregated' }] } }),
        /^site\.handles\.0\.allergen: Unknown allergen source 'gluten'/m,
      ],
      ['a book with both site and sites', book({ sites: [corpusSite()] }), /^sites: Give the kitchen either as site .* not both/m],
      [
        'a site id that looks like SQL',
        book({ site: undefined, sites: [corpusSite({ id: "shop' OR 1=1" })] }),
        /^sites\.0 \(shop' OR 1=1\)\.id: Use lower-case letters/m,
      ],
      [
        'two sites with one id',
        book({ site: undefined, sites: [corpusSite(), corpusSite()] }),
        /^sites\.1 \(corpus-shop\)\.id: The site id 'corpus-shop' is used by two sites/m,
      ],
      [
        'a substitution of an ingredient the book does not have',
        book({ site: undefined, sites: [corpusSite({ substitutions: [{ replaces: 'no-such-ingredient', with: 'corpus-cream' }] })] }),
        /^sites\.0 \(corpus-shop\)\.substitutions\.0\.replaces: 'no-such-ingredient' is not an ingredient of this book/m,
      ],
      [
        'an ingredient kept at a site the book does not have',
        book({ site: undefined, sites: [corpusSite()], ingredients: [ingredient({ onlyAt: 'corpus-cafe' })] }),
        /^ingredients\.0 \(corpus-cream\)\.onlyAt: 'corpus-cafe' is not a site of this book; its sites are corpus-shop\./m,
      ],
      [
        'a site selling a recipe the book does not have',
        book({ site: undefined, sites: [corpusSite({ sells: ['no-such-recipe'] })] }),
        /^sites\.0 \(corpus-shop\)\.sells\.0: 'no-such-recipe' is not a recipe of this book/m,
      ],
    ] as const
  ).map(([what, body, names]) => ({ what, method: 'POST' as const, url: '/api/book/import', send: () => json(body), status: 400, names })),
  {
    what: 'a book over 32 MB',
    method: 'POST',
    url: '/api/book/import',
    send: () =>
      json(book({ ingredients: Array.from({ length: 9000 }, (_, i) => ingredient({ id: `corpus-${i}`, composition: 'x'.repeat(3900) })) })),
    status: 413,
    names: /too large/,
  },

  // Kitchen: PATCH /api/kitchen
  ...(
    [
      ['no change at all', {}, /Change at least one field/],
      ['an unknown regime', { regime: 'XX' }, /^regime: /m],
      ['a regime in lower case', { regime: 'uk' }, /^regime: /m],
      ['unknown measures', { measures: 'imperial' }, /^measures: /m],
      ['measures that look like HTML', { measures: '<svg/onload=alert(1)>' }, /^measures: /m],
      ['an empty name', { name: '' }, /^name: Give the kitchen a name/m],
      ['a name with a lone surrogate', { name: 'Wrenfield \ud83d' }, /^name: This text has a broken character/m],
      ['a name with a line break', { name: 'Wrenfield\nLane' }, /^name: Leave out control characters/m],
      ['an address of 301 characters', { address: 'a'.repeat(301) }, /^address: Keep this to 300 characters/m],
      [
        'an allergen listed twice',
        {
          handles: [
            { allergen: 'milk', controls: 'segregated' },
            { allergen: 'milk', controls: 'shared-equipment' },
          ],
        },
        /^handles: List each allergen source once/m,
      ],
      ['an unknown way of handling', { handles: [{ allergen: 'milk', controls: 'ignored' }] }, /^handles\.0\.controls: /m],
      ['handles as text', { handles: 'milk' }, /^handles: Write this as a list/m],
    ] as const
  ).map(([what, body, names]) => ({ what, method: 'PATCH' as const, url: '/api/kitchen', send: () => json(body), status: 400, names })),

  // Users: POST /api/users and PATCH /api/users/:id
  ...(
    [
      [
        'an email longer than the column',
        user({ email: `${'e'.repeat(250)}@example.com` }),
        400,
        /^email: Use an email address of at most 254 characters/m,
      ],
      ['an email that is not one', user({ email: 'not-an-email' }), 400, /^email: Enter an email address/m],
      ['an email that looks like SQL', user({ email: "' OR 1=1 --" }), 400, /^email: Enter an email address/m],
      ['an email that exists', user({ email: 'chef@example.com' }), 409, /A user with that email already exists/],
      ['a name with a lone surrogate', user({ name: 'Corpus \ud83c' }), 400, /^name: This text has a broken character/m],
      ['a name of 121 characters', user({ name: 'n'.repeat(121) }), 400, /^name: Keep this to 120 characters/m],
      ['an unknown role', user({ role: 'admin' }), 400, /^role: /m],
      ['a role that looks like HTML', user({ role: '<script>manager</script>' }), 400, /^role: /m],
      ['a short password', user({ password: 'short-7' }), 400, /^password: Use at least 12 characters/m],
      [
        'a password with a lone surrogate',
        user({ password: 'a-long-pass-\ud800-7' }),
        400,
        /^password: This password has a broken character/m,
      ],
      ['a password of 10000 characters', user({ password: 'p4'.repeat(5000) }), 400, /^password: Use at most 72 bytes/m],
      ['no password', user({ password: undefined }), 400, /^password: /m],
    ] as const
  ).map(([what, body, status, names]) => ({ what, method: 'POST' as const, url: '/api/users', send: () => json(body), status, names })),
  ...(
    [
      ['no change at all', '/api/users/2', {}, 400, /Change at least one field/],
      ['a user that does not exist', '/api/users/999999', { name: 'Nobody' }, 404, /There is no user 999999/],
      ['a user id that is not a number', '/api/users/abc', { name: 'Nobody' }, 400, /numeric/],
      ['a user id that looks like SQL', `/api/users/${encodeURIComponent('2 OR 1=1')}`, { name: 'Nobody' }, 400, /numeric/],
      ['a user id of 21 digits', '/api/users/999999999999999999999', { name: 'Nobody' }, 404, /There is no user/],
      ['an active state as text', '/api/users/2', { active: 'no' }, 400, /^active: Write true or false/m],
      ['an unknown role', '/api/users/2', { role: 'owner' }, 400, /^role: /m],
      ['an empty name', '/api/users/2', { name: ' ' }, 400, /^name: Enter the person’s name/m],
      ['a name with NUL', '/api/users/2', { name: 'Chef\u0000' }, 400, /^name: Leave out control characters/m],
      ['a name with a lone surrogate', '/api/users/2', { name: 'Chef \ud83d' }, 400, /^name: This text has a broken character/m],
      ['an email, which cannot be changed', '/api/users/2', { email: 'new@example.com' }, 400, /email/],
    ] as const
  ).map(([what, url, body, status, names]) => ({ what, method: 'PATCH' as const, url, send: () => json(body), status, names })),

  // Invitations: POST /api/users/invitations and POST /api/users/:id/invitation
  ...(
    [
      ['an email that is not one', { email: 'not-an-email', name: 'Corpus', role: 'pastry-chef' }, 400, /^email: Enter an email address/m],
      [
        'an email longer than the column',
        { email: `${'e'.repeat(250)}@example.com`, name: 'Corpus', role: 'pastry-chef' },
        400,
        /^email: Use an email address of at most 254 characters/m,
      ],
      [
        'an email that exists',
        { email: 'chef@example.com', name: 'Corpus', role: 'pastry-chef' },
        409,
        /A user with that email already exists/,
      ],
      ['no name', { email: 'corpus-invite@example.com', role: 'pastry-chef' }, 400, /^name: /m],
      [
        'a name of 121 characters',
        { email: 'corpus-invite@example.com', name: 'n'.repeat(121), role: 'pastry-chef' },
        400,
        /^name: Keep this to 120/m,
      ],
      [
        'a name with NUL',
        { email: 'corpus-invite@example.com', name: 'Cor\u0000pus', role: 'pastry-chef' },
        400,
        /^name: Leave out control characters/m,
      ],
      ['an unknown role', { email: 'corpus-invite@example.com', name: 'Corpus', role: 'owner' }, 400, /^role: /m],
      [
        'a password, which the invited person chooses',
        { email: 'corpus-invite@example.com', name: 'Corpus', role: 'pastry-chef', password: 'a-long-pass-phrase-7' },
        400,
        /password/,
      ],
    ] as const
  ).map(([what, body, status, names]) => ({
    what,
    method: 'POST' as const,
    url: '/api/users/invitations',
    send: () => json(body),
    status,
    names,
  })),
  ...(
    [
      ['a user that does not exist', '/api/users/999999/invitation', 404, /There is no user 999999/],
      ['a user id that is not a number', '/api/users/abc/invitation', 400, /numeric/],
      ['a user id that looks like SQL', `/api/users/${encodeURIComponent('2 OR 1=1')}/invitation`, 400, /numeric/],
      ['a user who has chosen a password', '/api/users/2/invitation', 409, /has chosen a password already/],
    ] as const
  ).map(([what, url, status, names]) => ({ what, method: 'POST' as const, url, send: () => json({}), status, names })),

  // Forgot your password, and the mailed links
  ...(
    [
      ['no email', {}, /^email: /m],
      ['an email that is not one', { email: 'manager' }, /^email: Enter an email address/m],
      ['an email that looks like SQL', { email: "manager@example.com' OR '1'='1" }, /^email: Enter an email address/m],
      ['an email that is a list', { email: ['manager@example.com'] }, /^email: Write this as text/m],
    ] as const
  ).map(([what, body, names]) => ({
    what,
    method: 'POST' as const,
    url: '/api/auth/password-reset',
    send: () => json(body),
    status: 400,
    names,
  })),
  ...(
    [
      ['no token', {}, /^token: /m],
      ['an empty token', { token: '' }, /^token: Open the link in the mail/m],
      ['a token of 201 characters', { token: 'A'.repeat(201) }, /^token: This is not the link from the mail/m],
      ['a token that looks like SQL', { token: "x' OR '1'='1" }, /^token: This is not the link from the mail/m],
    ] as const
  ).map(([what, body, names]) => ({
    what,
    method: 'POST' as const,
    url: '/api/auth/account-link',
    send: () => json(body),
    status: 400,
    names,
  })),
  ...(
    [
      ['no token', { password: 'a-long-pass-phrase-7' }, 400, /^token: /m],
      ['a token with a slash', { token: 'abc/def', password: 'a-long-pass-phrase-7' }, 400, /^token: This is not the link from the mail/m],
      ['no password', { token: 'A'.repeat(43) }, 400, /^password: /m],
      ['a short password', { token: 'A'.repeat(43), password: 'short-7' }, 400, /^password: Use at least 12 characters/m],
      ['a common password', { token: 'A'.repeat(43), password: 'password1234' }, 400, /common passwords/],
      ['a link that was never sent', { token: 'A'.repeat(43), password: 'a-long-pass-phrase-7' }, 403, /This link is not known/],
    ] as const
  ).map(([what, body, status, names]) => ({
    what,
    method: 'POST' as const,
    url: '/api/auth/set-password',
    send: () => json(body),
    status,
    names,
  })),

  // The outbox: POST /api/mail/outbox/:id/retry
  ...(
    [
      ['a mail that does not exist', '/api/mail/outbox/999999/retry', /There is no mail 999999/],
      ['a mail id that is not a number', '/api/mail/outbox/abc/retry', /There is no mail abc/],
      ['a mail id that looks like SQL', `/api/mail/outbox/${encodeURIComponent('1 OR 1=1')}/retry`, /There is no mail 1 OR 1=1/],
    ] as const
  ).map(([what, url, names]) => ({ what, method: 'POST' as const, url, send: () => json({}), status: 404, names })),

  // Sign-in, first manager and sign-out
  ...(
    [
      [
        'an email longer than the column',
        { email: `${'e'.repeat(300)}@example.com`, password: 'crumbproof-demo' },
        /^email: Use an email address of at most 254 characters/m,
      ],
      ['no email', { password: 'crumbproof-demo' }, /^email: /m],
      ['an email that is a list', { email: ['manager@example.com'], password: 'crumbproof-demo' }, /^email: Write this as text/m],
      ['an email that looks like SQL', { email: "manager@example.com' OR '1'='1", password: 'x' }, /^email: Enter an email address/m],
      ['no password', { email: 'manager@example.com' }, /^password: /m],
      [
        'a password of 201 characters',
        { email: 'manager@example.com', password: 'p'.repeat(201) },
        /^password: Keep this to 200 characters/m,
      ],
    ] as const
  ).map(([what, body, names]) => ({ what, method: 'POST' as const, url: '/api/auth/sign-in', send: () => json(body), status: 400, names })),
  ...(
    [
      ['no token', { email: 'first@example.com', name: 'First', password: 'a-long-pass-phrase-7' }, 400, /^token: /m],
      [
        'an email longer than the column',
        { token: 'x', email: `${'f'.repeat(300)}@example.com`, name: 'First', password: 'a-long-pass-phrase-7' },
        400,
        /^email: Use an email address of at most 254/m,
      ],
      [
        'a name with a lone surrogate',
        { token: 'x', email: 'first@example.com', name: '\ud800', password: 'a-long-pass-phrase-7' },
        400,
        /^name: This text has a broken character/m,
      ],
      [
        'a link that was never printed',
        { token: 'not-a-printed-link', email: 'first@example.com', name: 'First', password: 'a-long-pass-phrase-7' },
        403,
        /This link has been used, has expired or was replaced/,
      ],
    ] as const
  ).map(([what, body, status, names]) => ({
    what,
    method: 'POST' as const,
    url: '/api/auth/first-manager',
    send: () => json(body),
    status,
    names,
  })),
  {
    what: 'JSON cut off in the middle',
    method: 'POST',
    url: '/api/auth/sign-out',
    send: () => raw('{"', 'application/json'),
    status: 400,
    names: /not valid JSON/,
  },
  {
    what: 'a form body',
    method: 'POST',
    url: '/api/auth/sign-out',
    send: () => raw('a=1', 'application/x-www-form-urlencoded'),
    status: 415,
    names: /application\/json/,
  },

  // Composition scan and declaration preview (nothing is saved by either)
  ...(
    [
      ['no text', {}, /^text: /m],
      ['text of 4001 characters', { text: 'w'.repeat(4001) }, /^text: Use at most 4,000 characters/m],
      ['text that is a number', { text: 42 }, /^text: Write this as text/m],
      ['text with a lone surrogate', { text: 'Wheat flour \ud83c' }, /^text: This text has a broken character/m],
      ['text with NUL', { text: 'Wheat\u0000flour' }, /^text: Leave out control characters/m],
      ['an unknown allergen in the list', { text: 'Wheat flour', contains: ['gluten'] }, /^contains\.0: Unknown allergen source 'gluten'/m],
    ] as const
  ).map(([what, body, names]) => ({
    what,
    method: 'POST' as const,
    url: '/api/composition/scan',
    send: () => json(body),
    status: 400,
    names,
  })),
  ...(
    [
      [
        'a line using an id that does not exist',
        '/api/declarations/preview',
        recipeWithLine({ use: 'no-such-ingredient' }),
        /no-such-ingredient/,
      ],
      ['a quantity of 5e-324 g', '/api/declarations/preview', recipeWithLine({ qty: 5e-324 }), /lines\.0\.qty: Use at least 0\.001 g/],
      ['an unknown regime', '/api/declarations/preview?regime=XX', recipe(), /Use one of EU, UK, US, CA, ANZ/],
      [
        'a regime that looks like SQL',
        `/api/declarations/preview?regime=${encodeURIComponent("UK' OR 1=1")}`,
        recipe(),
        /Use one of EU, UK, US, CA, ANZ/,
      ],
    ] as const
  ).map(([what, url, body, names]) => ({ what, method: 'POST' as const, url, send: () => json(body), status: 400, names })),

  // Spreadsheet import: the rows of the file, all or nothing
  ...(
    [
      [
        'an id in capitals',
        'id,name,contains,vegan,vegetarian\nCORPUS-CREAM,Corpus cream,milk,no,yes\n',
        /Use lower-case letters, digits and hyphens, e\.g\. 'corpus-cream'/,
      ],
      ['an id with an accent', 'id,name,contains,vegan,vegetarian\ncorpus-crème,Corpus cream,milk,no,yes\n', /e\.g\. 'corpus-creme'/],
      [
        'a header that looks like HTML',
        'id,name,<script>alert(1)</script>\ncorpus-cream,Corpus cream,x\n',
        /The column '<script>alert\(1\)<\/script>' is not one this import understands/,
      ],
      ['no id column', 'name,contains\nCorpus cream,milk\n', /\bid\b/],
      [
        'a fat figure over 100 g',
        'id,name,contains,vegan,vegetarian,fat\ncorpus-cream,Corpus cream,milk,no,yes,120\n',
        /column fat \('120'\): Use a number no larger than 100/,
      ],
      ['energy of 1e308 kJ', 'id,name,contains,vegan,vegetarian,energy kj\ncorpus-cream,Corpus cream,milk,no,yes,1e308\n', /energy/i],
      [
        'a name with a line break in a quoted cell',
        'id,name,contains,vegan,vegetarian\ncorpus-cream,"Corpus\ncream",milk,no,yes\n',
        /Leave out control characters/,
      ],
      [
        'an allergen that looks like SQL',
        "id,name,contains,vegan,vegetarian\ncorpus-cream,Corpus cream,milk'); DROP TABLE ingredients;--,no,yes\n",
        /is not an allergen source/,
      ],
      ['a file with NUL in it', 'id,name,contains,vegan,vegetarian\ncorpus-cream,Corpus\u0000cream,milk,no,yes\n', /not a recognised type/],
      ['a file that is an image', '', /neither|CSV|xlsx/i],
    ] as const
  ).map(([what, text, names]) => ({
    what,
    method: 'POST' as const,
    url: '/api/ingredients/import',
    send: () => (text === '' ? form({}, { name: 'photo.csv', bytes: fixture('label-photo.png') }) : form({}, csv(text))),
    status: 400,
    names,
  })),
  // A clean file needs the preview's basis: what the person saw is what is written, or nothing.
  ...(
    [
      ['a clean file without the preview’s basis', {}, /^basis: Preview the file first/m],
      ['a basis that is not JSON', { basis: 'rows 2 to 4' }, /^basis: The basis is not the one a preview gives/m],
      ['a basis of numbers', { basis: '{"2": 1}' }, /^basis: The basis is not the one a preview gives/m],
      ['a basis keyed by names', { basis: '{"two": "1.abc"}' }, /^basis: The basis is not the one a preview gives/m],
    ] as const
  ).map(([what, fields, names]) => ({
    what,
    method: 'POST' as const,
    url: '/api/ingredients/import',
    send: () => form(fields, { name: 'new.csv', bytes: fixture('new-ingredients.csv') }),
    status: 400,
    names,
  })),
  // The preview answers a readable file with each row's problems (and saves nothing); a file it cannot read is refused.
  {
    what: 'a file that is an image',
    method: 'POST',
    url: '/api/ingredients/import/preview',
    send: () => form({}, { name: 'photo.csv', bytes: fixture('label-photo.png') }),
    status: 400,
    names: /neither|CSV|xlsx/i,
  },

  // Specification upload: POST /api/ingredients/:code/specifications
  ...(
    [
      [
        'a review-by date without hyphens',
        '/api/ingredients/butter/specifications',
        { reviewBy: '20991201' },
        400,
        /^reviewBy: '20991201' is not a date written as YYYY-MM-DD/m,
      ],
      [
        'a review-by date in the past',
        '/api/ingredients/butter/specifications',
        { reviewBy: '2001-01-01' },
        400,
        /^reviewBy: 2001-01-01 has already passed/m,
      ],
      [
        'a review-by date that does not exist',
        '/api/ingredients/butter/specifications',
        { reviewBy: '2099-02-30' },
        400,
        /^reviewBy: 2099-02-30 is not a real date/m,
      ],
      [
        'a review-by date that looks like SQL',
        '/api/ingredients/butter/specifications',
        { reviewBy: "2099-01-01'; DROP TABLE specifications; --" },
        400,
        /^reviewBy: .* is not a date written as YYYY-MM-DD/m,
      ],
      [
        'a note of 501 characters',
        '/api/ingredients/butter/specifications',
        { reviewBy, note: 'n'.repeat(501) },
        400,
        /^note: Keep the note to 500 characters/m,
      ],
      [
        'a note with NUL',
        '/api/ingredients/butter/specifications',
        { reviewBy, note: 'From\u0000the mill' },
        400,
        /^note: Leave out control characters/m,
      ],
      [
        'an ingredient that does not exist',
        '/api/ingredients/no-such-ingredient/specifications',
        { reviewBy },
        404,
        /There is no ingredient 'no-such-ingredient'/,
      ],
      [
        'an ingredient in capitals',
        '/api/ingredients/BUTTER/specifications',
        { reviewBy },
        400,
        /^code: Use lower-case letters.*'butter'/m,
      ],
      [
        'an ingredient with an accent',
        `/api/ingredients/${encodeURIComponent('bütter')}/specifications`,
        { reviewBy },
        400,
        /^code: .*'butter'/m,
      ],
    ] as const
  ).map(([what, url, fields, status, names]) => ({ what, method: 'POST' as const, url, send: () => form(fields, pdf()), status, names })),
  {
    what: 'a text file instead of a PDF or image',
    method: 'POST',
    url: '/api/ingredients/butter/specifications',
    send: () => form({ reviewBy }, csv('id,name\n')),
    status: 400,
    names: /Only PDF files and images/,
  },
  {
    what: 'an HTML page named as a PDF',
    method: 'POST',
    url: '/api/ingredients/butter/specifications',
    send: () => form({ reviewBy }, { name: 'spec.pdf', bytes: Buffer.from('<html><script>alert(1)</script></html>') }),
    status: 400,
    names: /Only PDF files and images/,
  },
  {
    what: 'two files',
    method: 'POST',
    url: '/api/ingredients/butter/specifications',
    send: () => form({ reviewBy }, pdf(), pdf()),
    status: 400,
    names: /one file|file/,
  },

  // Labels: POST /api/labels/runs (nothing printed or logged) and PUT /api/labels/settings
  ...(
    [
      [
        'a production date that does not exist',
        labelRun({ productionDate: '2026-02-29' }),
        400,
        /^productionDate: 2026-02-29 is not a date that exists/m,
      ],
      [
        'a production date in another form',
        labelRun({ productionDate: '02/12/2026' }),
        400,
        /^productionDate: Write the date as YYYY-MM-DD/m,
      ],
      [
        'a count of zero',
        labelRun({ items: [{ product: 'vegan-brownie', quantity: 0 }] }),
        400,
        /^items\.0\.quantity: Print at least 1 label/m,
      ],
      [
        'a count of a fraction',
        labelRun({ items: [{ product: 'vegan-brownie', quantity: 1.5 }] }),
        400,
        /^items\.0\.quantity: .*whole number/m,
      ],
      [
        'a count above a run',
        labelRun({ items: [{ product: 'vegan-brownie', quantity: 1001 }] }),
        400,
        /^items\.0\.quantity: Print at most 1000/m,
      ],
      ['no products', labelRun({ items: [] }), 400, /^items: Pick at least one product/m],
      [
        'one product twice',
        labelRun({
          items: [
            { product: 'vegan-brownie', quantity: 1 },
            { product: 'vegan-brownie', quantity: 2 },
          ],
        }),
        400,
        /^items: List each product once/m,
      ],
      ['a batch code with a space', labelRun({ batch: 'LOT 7' }), 400, /^batch: .*character set 82.*a space/m],
      ['a batch code with an accent', labelRun({ batch: 'LOTÉ7' }), 400, /^batch: .*character set 82.*'É'/m],
      ['a batch code of 21 characters', labelRun({ batch: 'B'.repeat(21) }), 400, /^batch: .*at most 20 characters/m],
      ['a batch code that looks like SQL', labelRun({ batch: "7'; DROP TABLE label_runs; --" }), 400, /^batch: /m],
      ['a template that does not exist', labelRun({ template: 'poster' }), 400, /^template: There is no label template 'poster'/m],
      ['a template name that looks like a path', labelRun({ template: '../package' }), 400, /^template: /m],
      [
        'a product that does not exist',
        labelRun({ items: [{ product: 'no-such-cake', quantity: 1 }] }),
        400,
        /^items\.0\.product: There is no product 'no-such-cake'/m,
      ],
      [
        'a product that is not for sale',
        labelRun({ items: [{ product: 'pastry-cream', quantity: 1 }] }),
        400,
        /^items\.0\.product: .*not for sale/m,
      ],
      [
        'a product in capitals',
        labelRun({ items: [{ product: 'VEGAN-BROWNIE', quantity: 1 }] }),
        400,
        /^items\.0\.product: Use lower-case letters/m,
      ],
      ['units per case on a product label', labelRun({ unitsPerCase: 6 }), 400, /^unitsPerCase: /m],
      ['an override without a reason', labelRun({ override: {} }), 400, /^override\.reason: /m],
      [
        'an override when every revision is current',
        labelRun({ override: { reason: 'Spoiled in the printer this morning.' } }),
        400,
        /^override: /m,
      ],
      [
        'a revision that does not exist',
        labelRun({ items: [{ product: 'vegan-brownie', quantity: 1, revision: 99 }] }),
        400,
        /^items\.0\.revision: .*has no revision 99/m,
      ],
    ] as const
  ).map(([what, body, status, names]) => ({
    what,
    method: 'POST' as const,
    url: '/api/labels/runs',
    send: () => json(body),
    status,
    names,
  })),
  ...(
    [
      ['an unknown token', labelSettings({ batchPattern: '{YY}{MM}{DD}-{Q}-{N}' }), /^batchPattern: Unknown token \{Q\}/m],
      ['a pattern without a sequence', labelSettings({ batchPattern: '{YY}{MM}{DD}-{P}' }), /^batchPattern: Put a sequence token/m],
      [
        'a pattern that gives codes too long',
        labelSettings({ batchPattern: '{YYYY}{MM}{DD}-{P}-{P}-{NNN}' }),
        /^batchPattern: .*at most 20 characters/m,
      ],
      ['a pattern with a space', labelSettings({ batchPattern: 'L {JJJ}{N}' }), /^batchPattern: .*character set 82/m],
      [
        'a company prefix of letters',
        labelSettings({ gs1CompanyPrefix: '95212AB' }),
        /^gs1CompanyPrefix: A GS1 company prefix has 6 to 12 digits/m,
      ],
      ['a company prefix of 13 digits', labelSettings({ gs1CompanyPrefix: '9521234567890' }), /^gs1CompanyPrefix: /m],
      ['an extension digit of 10', labelSettings({ ssccExtension: 10 }), /^ssccExtension: Give the SSCC extension digit, 0 to 9/m],
      ['a case indicator of 9', labelSettings({ caseIndicator: 9 }), /^caseIndicator: Give the case indicator digit, 1 to 8/m],
      ['a case indicator of 0', labelSettings({ caseIndicator: 0 }), /^caseIndicator: /m],
      // PUT replaces every setting: one left out is named, never put back to its default.
      ['no settings at all', {}, /^batchPattern: Write the batch pattern as text/m],
      ['a body without the company prefix', { ...labelSettings(), gs1CompanyPrefix: undefined }, /^gs1CompanyPrefix: /m],
    ] as const
  ).map(([what, body, names]) => ({
    what,
    method: 'PUT' as const,
    url: '/api/labels/settings',
    send: () => json(body),
    status: 400,
    names,
  })),

  // Counter: PUT /api/counter/today, POST /api/counter/questions, POST /api/counter/questions/:id/answer
  ...(
    [
      [
        'PUT',
        '/api/counter/today',
        'a day that does not exist',
        counterDay({ date: '2026-02-29' }),
        400,
        /^date: 2026-02-29 is not a date that exists/m,
      ],
      [
        'PUT',
        '/api/counter/today',
        'a day in another form',
        counterDay({ date: '2 December 2026' }),
        400,
        /^date: Write the date as YYYY-MM-DD/m,
      ],
      [
        'PUT',
        '/api/counter/today',
        'products as one text',
        counterDay({ products: 'vegan-brownie' }),
        400,
        /^products: List the products/m,
      ],
      [
        'PUT',
        '/api/counter/today',
        'a product that does not exist',
        counterDay({ products: ['vegan-brownie', 'no-such-cake'] }),
        400,
        /^products\.1: There is no product 'no-such-cake'/m,
      ],
      [
        'PUT',
        '/api/counter/today',
        'a recipe not for sale',
        counterDay({ products: ['pastry-cream'] }),
        400,
        /^products\.0: .*not for sale/m,
      ],
      [
        'PUT',
        '/api/counter/today',
        'one product twice',
        counterDay({ products: ['vegan-brownie', 'vegan-brownie'] }),
        400,
        /^products: List each product once/m,
      ],
      [
        'PUT',
        '/api/counter/today',
        'a product id that looks like SQL',
        counterDay({ products: ["x' OR '1'='1"] }),
        400,
        /^products\.0: Use lower-case letters/m,
      ],
      [
        'PUT',
        '/api/counter/today',
        '501 products',
        counterDay({ products: Array.from({ length: 501 }, (_, i) => `p-${i}`) }),
        400,
        /^products: List at most 500 products/m,
      ],
      ['POST', '/api/counter/questions', 'no product', counterQuestion({ product: undefined }), 400, /^product: /m],
      [
        'POST',
        '/api/counter/questions',
        'a product that does not exist',
        counterQuestion({ product: 'no-such-cake' }),
        400,
        /^product: There is no product 'no-such-cake'/m,
      ],
      [
        'POST',
        '/api/counter/questions',
        'a recipe not for sale',
        counterQuestion({ product: 'pastry-cream' }),
        400,
        /^product: .*not for sale/m,
      ],
      ['POST', '/api/counter/questions', 'nothing to avoid', counterQuestion({ avoid: [] }), 400, /^avoid: Pick at least one allergen/m],
      [
        'POST',
        '/api/counter/questions',
        'an allergen that is not one',
        counterQuestion({ avoid: ['eggs', 'chocolate'] }),
        400,
        /^avoid\.1: Unknown allergen 'chocolate'/m,
      ],
      [
        'POST',
        '/api/counter/questions',
        'an allergen that looks like HTML',
        counterQuestion({ avoid: ['<b>egg</b>'] }),
        400,
        /^avoid\.0: Name each allergen as its code/m,
      ],
      [
        'POST',
        '/api/counter/questions',
        'one allergen twice',
        counterQuestion({ avoid: ['eggs', 'eggs'] }),
        400,
        /^avoid: Name each allergen once/m,
      ],
      [
        'POST',
        '/api/counter/questions',
        'a note with NUL',
        counterQuestion({ note: 'Ask\u0000 the chef' }),
        400,
        /^note: Leave out control characters/m,
      ],
      [
        'POST',
        '/api/counter/questions',
        'a note of 501 characters',
        counterQuestion({ note: 'n'.repeat(501) }),
        400,
        /^note: Keep the note to 500 characters/m,
      ],
      ['POST', '/api/counter/questions/1/answer', 'an empty answer', { answer: '  ' }, 400, /^answer: Write the answer for the counter/m],
      [
        'POST',
        '/api/counter/questions/1/answer',
        'an answer with a lone surrogate',
        { answer: 'Yes \ud83c' },
        400,
        /^answer: This text has a broken character/m,
      ],
      [
        'POST',
        '/api/counter/questions/1/answer',
        'an answer of 1001 characters',
        { answer: 'a'.repeat(1001) },
        400,
        /^answer: Keep the answer to 1000 characters/m,
      ],
      [
        'POST',
        '/api/counter/questions/1/answer',
        'a question that does not exist',
        { answer: 'Yes, as recorded.' },
        404,
        /There is no question 1\b/,
      ],
      [
        'POST',
        '/api/counter/questions/abc/answer',
        'a question id that is not a number',
        { answer: 'Yes, as recorded.' },
        404,
        /There is no question 'abc'/,
      ],
    ] as const
  ).map(([method, url, what, body, status, names]) => ({ what, method, url, send: () => json(body), status, names })),

  // Approvals: POST /api/approvals (the demo starts approved, so nothing waits)
  ...(
    [
      ['no products', {}, 400, /^products: List the products to approve, each with its inputHash/m],
      ['an empty list', { products: [] }, 400, /^products: Pick at least one product to approve/m],
      ['a list as text', { products: 'vegan-brownie' }, 400, /^products: List the products to approve/m],
      [
        'an inputHash that is no hash',
        { products: [{ product: 'vegan-brownie', inputHash: 'xyz' }] },
        400,
        /^products\.0\.inputHash: Give the declaration’s inputHash, as GET \/api\/approvals lists it \(64/m,
      ],
      ['no inputHash', { products: [{ product: 'vegan-brownie' }] }, 400, /^products\.0\.inputHash: Give the declaration’s inputHash/m],
      ['a product id written another way', { products: [{ product: 'Vegan Brownie', inputHash: HASH }] }, 400, /^products\.0\.product: /m],
      [
        'one product twice',
        {
          products: [
            { product: 'vegan-brownie', inputHash: HASH },
            { product: 'vegan-brownie', inputHash: HASH },
          ],
        },
        400,
        /^products: List each product once/m,
      ],
      ['a field it does not take', { products: [{ product: 'vegan-brownie', inputHash: HASH }], approvedBy: 1 }, 400, /approvedBy/],
      [
        'a note of 501 characters',
        { products: [{ product: 'vegan-brownie', inputHash: HASH }], note: 'n'.repeat(501) },
        400,
        /^note: Keep the note to 500/m,
      ],
      [
        'a product that does not exist',
        { products: [{ product: 'no-such-cake', inputHash: HASH }] },
        400,
        /There is no product 'no-such-cake'/,
      ],
      [
        'a recipe not for sale',
        { products: [{ product: 'vanilla-sponge', inputHash: HASH }] },
        400,
        /is a recipe, not for sale: there is nothing to approve/,
      ],
      ['a product approved already', { products: [{ product: 'vegan-brownie', inputHash: HASH }] }, 400, /is approved already/],
    ] as const
  ).map(([what, body, status, names]) => ({ what, method: 'POST' as const, url: '/api/approvals', send: () => json(body), status, names })),

  // Out-of-date labels: POST /api/labels/stale/:id/handled (nothing printed yet, so nothing is out of date)
  ...(
    [
      ['/api/labels/stale/1-0/handled', 'no note', {}, 400, /^note: Say what was done/m],
      [
        '/api/labels/stale/1-0/handled',
        'an empty note',
        { note: '   ' },
        400,
        /^note: Say what was done \(reprinted, withdrawn, thrown away\)/m,
      ],
      ['/api/labels/stale/1-0/handled', 'a note of 501 characters', { note: 'n'.repeat(501) }, 400, /^note: Keep the note to 500/m],
      ['/api/labels/stale/1-0/handled', 'a field it does not take', { note: 'Withdrawn.', by: 'me' }, 400, /by/],
      [
        '/api/labels/stale/1-0/handled',
        'labels that are not out of date',
        { note: 'Withdrawn.' },
        404,
        /There are no out-of-date labels '1-0'/,
      ],
      [
        '/api/labels/stale/abc/handled',
        'an id that is no printed item',
        { note: 'Withdrawn.' },
        404,
        /There are no out-of-date labels 'abc'/,
      ],
    ] as const
  ).map(([url, what, body, status, names]) => ({ what, method: 'POST' as const, url, send: () => json(body), status, names })),

  // The public product page's settings: PUT /api/public-page/settings
  ...(
    [
      ['on with no address', { enabled: true, baseUrl: null }, /^baseUrl: Give the address customers reach Crumbproof at/m],
      ['on as text', { enabled: 'yes', baseUrl: null }, /^enabled: Say whether the public product page is on/m],
      ['an address that is no address', { enabled: true, baseUrl: 'menu dot example' }, /^baseUrl: Write a whole address/m],
      ['an address of another scheme', { enabled: true, baseUrl: 'javascript:alert(1)' }, /^baseUrl: Use an address starting with https:/m],
      ['an address with a password', { enabled: true, baseUrl: 'https://a:b@menu.example.com' }, /^baseUrl: Leave the user name/m],
      [
        'an address with a query',
        { enabled: true, baseUrl: 'https://menu.example.com/?x=1' },
        /^baseUrl: Leave out anything after \? or #/m,
      ],
      [
        'an address of 121 characters',
        { enabled: true, baseUrl: `https://${'m'.repeat(105)}.example` },
        /^baseUrl: Keep the address to 120/m,
      ],
      ['a field it does not take', { enabled: false, baseUrl: null, theme: 'dark' }, /theme/],
    ] as const
  ).map(([what, body, names]) => ({
    what,
    method: 'PUT' as const,
    url: '/api/public-page/settings',
    send: () => json(body),
    status: 400,
    names,
  })),

  // Routes that do not exist: nothing can be deleted
  ...(
    [
      ['DELETE', '/api/ingredients/butter'],
      ['DELETE', '/api/recipes/vanilla-sponge'],
      ['DELETE', '/api/users/2'],
      ['DELETE', '/api/kitchen'],
      ['DELETE', '/api/book'],
      ['DELETE', '/api/specifications/1/file'],
      ['PATCH', '/api/ingredients/butter'],
      ['PUT', '/api/kitchen'],
      ['DELETE', '/api/labels/runs/1/pdf'],
      ['PUT', '/api/labels/runs'],
      ['DELETE', '/api/counter/today'],
      ['DELETE', '/api/counter/questions/1'],
    ] as const
  ).map(([method, url]) => ({
    what: 'a method the route does not take',
    method,
    url,
    send: nothing,
    status: 404,
    names: /There is nothing at this address/,
  })),
];

describe('malformed requests to every write route are refused with a 4xx naming the problem, and change no table (real MariaDB)', () => {
  let t: TestApp;
  let manager: string;
  beforeAll(async () => {
    t = await startTestApp({ seed: true });
    manager = await t.signIn('manager@example.com');
  });
  afterAll(() => t.close());

  it('holds at least 150 requests, with some for every route of the app that writes', () => {
    expect(CORPUS.length).toBeGreaterThanOrEqual(150);
    const discovery = t.app.get(DiscoveryService);
    const scanner = t.app.get(MetadataScanner);
    const writes: { method: string; pattern: RegExp; route: string }[] = [];
    for (const wrapper of discovery.getControllers()) {
      const base = String(Reflect.getMetadata(PATH_METADATA, wrapper.metatype as object) ?? '');
      const proto = Object.getPrototypeOf(wrapper.instance as object);
      for (const name of scanner.getAllMethodNames(proto)) {
        const path = Reflect.getMetadata(PATH_METADATA, proto[name]) as string | undefined;
        const method = RequestMethod[Reflect.getMetadata(METHOD_METADATA, proto[name]) as number];
        if (path === undefined || !['POST', 'PUT', 'PATCH', 'DELETE'].includes(method)) continue;
        const route = `/api/${[base, path].filter((p) => p && p !== '/').join('/')}`.replace(/\/+/g, '/');
        writes.push({ method, route, pattern: new RegExp(`^${route.replace(/:[^/]+/g, '[^/]+')}(\\?.*)?$`) });
      }
    }
    expect(writes.length).toBeGreaterThanOrEqual(18);
    const uncovered = writes
      .filter((w) => !CORPUS.some((c) => c.method === w.method && w.pattern.test(c.url)))
      .map((w) => `${w.method} ${w.route}`);
    expect(uncovered).toEqual([]);
  });

  it.each(CORPUS.map((c) => ({ ...c, title: `${c.method} ${c.url.length > 70 ? `${c.url.slice(0, 70)}…` : c.url}: ${c.what}` })))(
    '$title',
    async ({ method, url, send, status, names }) => {
      const before = await tableChecksums(t.sequelize);
      const sent = await send();
      const res = await t.app.inject({ method, url, payload: sent.payload, headers: { ...sent.headers, cookie: manager } });
      const body = res.json<{
        message?: string;
        fields?: { path: string; message: string }[];
        problems?: unknown[];
        rows?: { problems: string[] }[];
      }>();
      const said = [
        body.message ?? '',
        ...(body.fields ?? []).map((f) => `${f.path}: ${f.message}`),
        ...(body.rows ?? []).flatMap((r) => r.problems),
      ].join('\n');
      expect({ status: res.statusCode, said }).toEqual({ status, said: expect.stringMatching(names) });
      expect(await tableChecksums(t.sequelize)).toEqual(before);
    },
  );
});
