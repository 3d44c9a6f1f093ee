import { copyFileSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { LABEL_TEMPLATES_DIR, loadLabelTemplates } from './label-templates';
import { labelFonts } from './pdf-node';

/** The templates the API loads at start: a bad one stops the start, naming its file and field. */
describe('the label templates the API loads at start', () => {
  let dir: string;
  beforeEach(() => {
    dir = mkdtempSync(join(tmpdir(), 'label-templates-'));
    for (const name of ['product.json', 'case.json']) copyFileSync(join(LABEL_TEMPLATES_DIR, name), join(dir, name));
  });
  afterEach(() => rmSync(dir, { recursive: true, force: true }));

  const product = () => JSON.parse(readFileSync(join(LABEL_TEMPLATES_DIR, 'product.json'), 'utf8'));

  it('loads the four shipped templates, and knows which print a batch code', () => {
    const loaded = loadLabelTemplates(LABEL_TEMPLATES_DIR, labelFonts());
    expect([...loaded.keys()].sort()).toEqual(['case', 'chart', 'product', 'ticket']);
    expect(Object.fromEntries([...loaded].map(([id, t]) => [id, t.printsBatch]))).toEqual({
      case: true,
      chart: false,
      product: true,
      ticket: false,
    });
  });

  it('refuses a template that fails its schema, naming the file and the field', () => {
    const raw = product();
    raw.blocks[1].sizePt = 'large';
    writeFileSync(join(dir, 'product.json'), JSON.stringify(raw));
    expect(() => loadLabelTemplates(dir, labelFonts())).toThrow(/label-templates\/product\.json, blocks\[1\]\.sizePt: /);
  });

  it('refuses a template that sets mandatory text below the legal x-height, naming the field (Regulation (EU) No 1169/2011 Annex IV)', () => {
    const raw = product();
    raw.blocks[1].sizePt = 4;
    writeFileSync(join(dir, 'product.json'), JSON.stringify(raw));
    expect(() => loadLabelTemplates(dir, labelFonts())).toThrow(
      /label-templates\/product\.json, blocks\[1\]\.sizePt: .*4 pt.*x-height 1\.2 mm/,
    );
  });

  it('refuses a file that is not JSON, naming it', () => {
    writeFileSync(join(dir, 'ticket.json'), '{ "id": "ticket",');
    expect(() => loadLabelTemplates(dir)).toThrow(/label-templates\/ticket\.json, \(the file\): It is not valid JSON/);
  });
});
