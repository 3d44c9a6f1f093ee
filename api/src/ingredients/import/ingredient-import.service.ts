import { createHash } from 'node:crypto';
import { Injectable } from '@nestjs/common';
import {
  bookIngredientSchema,
  cellPlace,
  formatIssue,
  type Book,
  type BookProblem,
  type FieldError,
  IMPORT_COLUMNS,
  IMPORT_RULES,
  type ImportAction,
  type ImportCounts,
  type ImportPreview,
  type ImportResult,
  type ImportRow,
  type StaleImportRow,
} from '@crumbproof/shared';
import { z } from 'zod';
import { AppError } from '../../common/app-error';
import { BooksService, savedAtWords, type KitchenState } from '../../books/books.service';
import { sameData } from '../../rules/core/same-data';
import { RulesService } from '../../rules/rules.service';
import type { Upload } from '../../common/multipart-upload';
import type { Transaction } from 'sequelize';
import { cellText, mapHeader, rowPlace, rowToCandidate, type HeaderMap } from './import-columns';
import { readSheet, type SheetRow } from './spreadsheet';

/** Previews and imports ingredients from a CSV file or an Excel workbook; all or nothing. */
@Injectable()
export class IngredientImportService {
  constructor(
    private readonly books: BooksService,
    private readonly rules: RulesService,
  ) {}

  /** What the file would change; nothing is saved. */
  async preview(upload: Upload): Promise<ImportPreview> {
    if (!upload.file)
      throw new AppError('validation', 'Attach a CSV file or an Excel workbook (.xlsx) in the field file.', [
        { path: 'file', message: 'Attach a file.' },
      ]);
    const sheet = await readSheet(upload.file.bytes);
    const state = await this.books.state();
    const book = state.book;
    const header = mapHeader(sheet.header);
    const problems = [...sheet.problems, ...header.problems];
    const idColumn = [...header.columns].find(([, d]) => d.field === 'id')?.[0];
    const nameColumn = [...header.columns].find(([, d]) => d.field === 'name')?.[0];
    const rows = idColumn === undefined || nameColumn === undefined ? [] : this.readRows(sheet.rows, header, idColumn, nameColumn, state);
    if (rows.length > 0) this.checkDeclarable(rows, book, header, problems);
    const basis = JSON.stringify(Object.fromEntries(rows.filter((r) => r.base).map((r) => [String(r.row), r.base!.token])));
    return { format: sheet.format, columns: IMPORT_COLUMNS, rules: IMPORT_RULES, problems, rows, summary: count(rows), basis };
  }

  /** Imports every row in one transaction, or nothing when any row or the file has a problem. */
  async import(upload: Upload, authorId: number): Promise<ImportResult> {
    const preview = await this.preview(upload);
    const bad = preview.rows.filter((r) => r.problems.length > 0);
    if (preview.problems.length > 0 || bad.length > 0) throw refused(preview.problems, bad);
    const basis = parseBasis(upload.fields.basis);
    // Inside the write's lock: every row's ingredient must be as the person's preview saw it.
    const check = (state: KitchenState, t: Transaction) => this.assertUnchanged(preview.rows, basis, state, t);
    const changes = preview.rows.filter((r) => r.action !== 'unchanged').map((r) => r.ingredient!);
    const note = `Imported from ${upload.file!.filename || 'a spreadsheet'}`.slice(0, 300);
    const { create: created, update: updated } = preview.summary;
    const audit = {
      action: 'ingredients.imported' as const,
      record: { kind: 'spreadsheet', id: (upload.file!.filename || 'a spreadsheet').slice(0, 120) },
      summary: `${note}: ${created} ingredient${created === 1 ? '' : 's'} added, ${updated} revised.`,
    };
    if (changes.length === 0) {
      await this.books.readLocked(check);
      return { ...preview.summary, written: [] };
    }
    const written = await this.books.writeItems({ ingredients: changes }, { authorId, note }, 'any', audit, check);
    return { ...preview.summary, written };
  }

  /** Refuses the import (stale-preview, nothing saved) when a row's ingredient was created or revised after the preview. */
  private async assertUnchanged(rows: ImportRow[], basis: Record<string, string>, state: KitchenState, t: Transaction): Promise<void> {
    const moved = rows.filter((r) => r.base && basis[String(r.row)] !== rowToken(r.ingredient!.id, state.heads.get(r.ingredient!.id)));
    if (moved.length === 0) return;
    const ids = moved.map((r) => r.ingredient!.id);
    const saves = await this.books.currentSaves(state, ids, t);
    // The token the person sent back starts with the revision their preview saw (0: none).
    const previewed = (r: ImportRow): number | null => Number(/^(\d+)\./.exec(basis[String(r.row)] ?? '')?.[1] ?? 0) || null;
    const staleRows: StaleImportRow[] = moved.map((r) => {
      const save = saves.get(r.ingredient!.id);
      return {
        row: r.row,
        id: r.ingredient!.id,
        previewRevision: previewed(r),
        currentRevision: state.heads.get(r.ingredient!.id)?.revision ?? null,
        authorName: save?.authorName ?? null,
        savedAt: save?.savedAt ?? null,
      };
    });
    const words = staleRows.map((s) => {
      const who = s.authorName ?? 'someone without a kitchen account';
      const what = s.previewRevision === null && s.currentRevision === 1 ? 'created it' : `saved revision ${s.currentRevision}`;
      return `Row ${s.row} (${s.id}): ${who} ${what}${s.savedAt ? ` at ${savedAtWords(s.savedAt)}` : ''}.`;
    });
    throw new AppError(
      'stale-preview',
      `Nothing was imported: ${staleRows.length === 1 ? "1 row's ingredient" : `${staleRows.length} rows' ingredients`} changed since the preview. ${words.join(' ')} Preview the file again to see what it would change now.`,
      undefined,
      undefined,
      { staleRows },
    );
  }

  private readRows(
    sheetRows: SheetRow[],
    header: HeaderMap,
    idColumn: number,
    nameColumn: number | undefined,
    state: KitchenState,
  ): ImportRow[] {
    const book = state.book;
    const existing = new Map(book.ingredients.map((i) => [i.id.toLowerCase(), i]));
    const recipes = new Map(book.recipes.map((r) => [r.id.toLowerCase(), r.id]));
    const rows = sheetRows.map(({ row, cells }): ImportRow => {
      const id = cellText(cells[idColumn] ?? null);
      const base = existing.get(id.toLowerCase());
      const place = rowPlace(header, row);
      const { candidate, problems } = rowToCandidate(cells, header, base, row);
      cells.forEach((cell, i) => {
        if ((header.blank.has(i) || i >= header.width) && cellText(cell) !== '') {
          const where = cellPlace(row, () => columnLetter(i))([]);
          problems.push(`${where}: '${cellText(cell)}' is under no header; name the column in row 1 or clear the cell.`);
        }
      });
      if (base && base.id !== id)
        problems.push(`${place(['id'])}: '${id}' differs only in capitals from the existing ingredient '${base.id}'; write '${base.id}'.`);
      if (recipes.has(id.toLowerCase()))
        problems.push(
          `${place(['id'])}: '${id}' is already the id of the recipe '${recipes.get(id.toLowerCase())}'; give the ingredient an id of its own.`,
        );
      // reportInput: the message shows the value the cell held.
      const parsed = bookIngredientSchema.safeParse(candidate, { reportInput: true });
      if (!parsed.success) for (const issue of parsed.error.issues) problems.push(formatIssue(issue, place));
      const ingredient = parsed.success && problems.length === 0 ? parsed.data : null;
      const action: ImportAction = !base ? 'create' : ingredient && sameData(base, ingredient) ? 'unchanged' : 'update';
      return {
        row,
        idCell: id,
        nameCell: nameColumn === undefined ? '' : cellText(cells[nameColumn] ?? null),
        ingredient,
        action,
        problems,
        base: id === '' ? null : { revision: state.heads.get(id)?.revision ?? null, token: rowToken(id, state.heads.get(id)) },
      };
    });
    const ids = sheetRows.map(({ cells }) => cellText(cells[idColumn] ?? null));
    const byId = new Map<string, number[]>();
    ids.forEach((id, i) => {
      if (id !== '') byId.set(id.toLowerCase(), [...(byId.get(id.toLowerCase()) ?? []), i]);
    });
    for (const group of byId.values()) {
      if (group.length < 2) continue;
      const numbers = group.map((i) => rows[i].row).join(', ');
      for (const i of group)
        rows[i].problems.push(
          `${rowPlace(header, rows[i].row)(['id'])}: '${ids[i]}' is on rows ${numbers}; each ingredient may be on one row only.`,
        );
    }
    return rows;
  }

  /** The kitchen must still be declarable with the new ingredients (e.g. a recipe in ml needs g per ml). */
  private checkDeclarable(rows: ImportRow[], book: Book, header: HeaderMap, fileProblems: string[]) {
    const good = rows.filter((r) => r.ingredient && r.problems.length === 0).map((r) => r.ingredient!);
    if (good.length === 0) return;
    const incoming = new Map(good.map((g) => [g.id, g]));
    const merged: Book = { ...book, ingredients: [...book.ingredients.filter((i) => !incoming.has(i.id)), ...good] };
    for (const p of this.rules.check(merged)) {
      const { id, column } = rowOfProblem(p);
      const target = id === undefined ? undefined : rows.find((r) => r.ingredient?.id === id);
      if (target) target.problems.push(`${rowPlace(header, target.row)(column)}: ${p.message}`);
      else fileProblems.push(p.message);
    }
  }
}

/** The ingredient a book problem is about, and the column that would settle it ([] for the row as a whole). */
function rowOfProblem(p: BookProblem): { id?: string; column: string[] } {
  switch (p.code) {
    case 'unweighable-line':
      return { id: p.use, column: p.needs === 'grams' ? [] : [p.needs] };
    case 'duplicate-id':
      return { id: p.id, column: ['id'] };
    case 'unknown-reference':
    case 'recipe-cycle':
      return { column: [] };
  }
}

/**
 * A token of the state a row's ingredient is in: its current revision (0 when it does not exist),
 * then a hash of the id with it. Revisions only ever grow, so an equal token means nobody saved or
 * created the ingredient since.
 */
function rowToken(id: string, head: { revision: number } | undefined): string {
  const revision = head ? head.revision : 0;
  return `${revision}.${createHash('sha256').update(`ingredient-import\n${id}\n${revision}`).digest('base64url').slice(0, 22)}`;
}

const basisSchema = z.record(z.string().regex(/^\d+$/), z.string().max(100));

/** The preview's basis, sent back with the import; without it the import cannot know what the person saw. */
function parseBasis(text: string | undefined): Record<string, string> {
  const missing = 'Preview the file first, then import it with the basis the preview gave (the form field basis).';
  if (text === undefined || text === '') throw new AppError('validation', missing, [{ path: 'basis', message: missing }]);
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch {
    value = undefined;
  }
  const parsed = basisSchema.safeParse(value);
  if (!parsed.success) {
    const message = "The basis is not the one a preview gives: send the preview's basis as it came. Preview the file again if it is lost.";
    throw new AppError('validation', message, [{ path: 'basis', message }]);
  }
  return parsed.data;
}

/** 0 → A, 25 → Z, 26 → AA. */
function columnLetter(i: number): string {
  return i < 26 ? String.fromCharCode(65 + i) : columnLetter(Math.floor(i / 26) - 1) + String.fromCharCode(65 + (i % 26));
}

function count(rows: ImportRow[]): ImportCounts {
  return {
    create: rows.filter((r) => r.problems.length === 0 && r.action === 'create').length,
    update: rows.filter((r) => r.problems.length === 0 && r.action === 'update').length,
    unchanged: rows.filter((r) => r.problems.length === 0 && r.action === 'unchanged').length,
    withProblems: rows.filter((r) => r.problems.length > 0).length,
  };
}

function refused(fileProblems: string[], bad: ImportRow[]): AppError {
  const fields: FieldError[] = [
    ...fileProblems.map((message) => ({ path: 'file', message })),
    ...bad.flatMap((r) => r.problems.map((message) => ({ path: `row ${r.row}`, message }))),
  ];
  const parts: string[] = [];
  if (bad.length > 0) {
    const numbers = bad.map((r) => r.row);
    parts.push(
      `${bad.length} row${bad.length > 1 ? 's need' : ' needs'} attention (row${bad.length > 1 ? 's' : ''} ${numbers.slice(0, 20).join(', ')}${numbers.length > 20 ? ', …' : ''}).`,
    );
    // Each problem starts a sentence here: "Row 3, column vegan: …".
    for (const r of bad.slice(0, 5)) parts.push(...r.problems.map((p) => p.charAt(0).toUpperCase() + p.slice(1)));
    if (bad.length > 5) parts.push(`… and ${bad.length - 5} more rows.`);
  }
  parts.push(...fileProblems);
  return new AppError('validation', `Nothing was imported: ${parts.join(' ')}`, fields);
}
