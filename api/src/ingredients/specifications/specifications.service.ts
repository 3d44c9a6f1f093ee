import { Inject, Injectable, StreamableFile } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { AppError } from '../../common/app-error';
import { AuditService } from '../../audit/audit.service';
import { TransactionRunner } from '../../common/transaction';
import { validationError } from '../../common/zod.pipe';
import type { Head } from '../../common/revisioned.repository';
import type { AppConfig } from '../../config/config';
import { KitchenService } from '../../kitchen/kitchen.service';
import { SiteRepository } from '../../kitchen/site.repository';
import { UsersRepository } from '../../users/users.repository';
import { IngredientsRepository } from '../ingredients.repository';
import { Clock } from '../../common/clock';
import { ACCEPTED_SPECIFICATION_TYPES, addDays, defaultReviewBy, specificationFieldsSchema, today } from './specification.dto';
import type {
  ClaimBasis,
  ReviewsDue,
  StatementOnlyLeaf,
  SpecificationReview,
  SpecificationReviewWarning,
  SpecificationStatus,
  SpecificationView,
} from '@crumbproof/shared';
import { describeType, detectType, safeFilename, withExtension, type Upload } from '../../common/multipart-upload';
import { SpecificationsRepository, type SpecificationRow } from './specifications.repository';
import { FILE_STORE, type FileStore } from '../../storage/file-store';
import { keepFile, readStoredFile } from '../../storage/stored-file-errors';

/** Supplier specifications of ingredients: versioned uploads with a date to check them again. */
@Injectable()
export class SpecificationsService {
  constructor(
    private readonly repo: SpecificationsRepository,
    private readonly ingredients: IngredientsRepository,
    private readonly kitchen: KitchenService,
    private readonly users: UsersRepository,
    private readonly tx: TransactionRunner,
    private readonly sites: SiteRepository,
    private readonly config: ConfigService<AppConfig, true>,
    private readonly audit: AuditService,
    private readonly clock: Clock,
    @Inject(FILE_STORE) private readonly files: FileStore,
  ) {}

  /** The kitchen's date now (the server's calendar, as `today()` counts it). */
  today(): string {
    return today(this.clock.now());
  }

  private async ingredient(code: string): Promise<Head> {
    const found = await this.ingredients.findHead((await this.kitchen.owner()).id, code);
    if (!found) throw new AppError('not-found', `There is no ingredient '${code}'.`);
    return found;
  }

  /** Who uploaded each row, by user id. */
  private async uploaders(): Promise<Map<number, string>> {
    return new Map((await this.users.list()).map((u) => [u.id, u.name]));
  }

  /** Checks the whole upload before anything is written: fields, then the file's content. */
  async upload(code: string, upload: Upload, userId: number): Promise<SpecificationView> {
    const ingredient = await this.ingredient(code);
    const parsed = specificationFieldsSchema.safeParse(upload.fields);
    const fieldErrors = parsed.success ? [] : (validationError(parsed.error).fields ?? []);
    if (!upload.file) fieldErrors.push({ path: 'file', message: 'Attach the specification (a PDF or an image) in the field file.' });
    else if (upload.file.bytes.length === 0) fieldErrors.push({ path: 'file', message: 'The file is empty.' });
    if (fieldErrors.length > 0 || !parsed.success || !upload.file) {
      throw new AppError(
        'validation',
        `Some fields need attention. ${fieldErrors.map((f) => `${f.path}: ${f.message}`).join(' ')}`,
        fieldErrors,
      );
    }
    const { bytes, filename } = upload.file;
    const type = await detectType(bytes);
    if (!type || !(type.mime in ACCEPTED_SPECIFICATION_TYPES)) {
      const message = `Only PDF files and images (PNG, JPEG, WebP) can be attached; this file is ${describeType(type)}.`;
      throw new AppError('validation', message, [{ path: 'file', message }]);
    }
    const reviewBy = parsed.data.reviewBy || defaultReviewBy(this.today());
    const quota = this.config.get('KITCHEN_FILE_QUOTA_MB', { infer: true });
    const kitchen = await this.kitchen.owner();
    const row = await this.tx.run(async (t) => {
      // The kitchen first (as every kitchen write does), so two uploads cannot together pass its quota.
      await this.sites.lock(t);
      await this.ingredients.lockHead(ingredient.id, t);
      const stored = await this.repo.storedBytes(kitchen.id, t);
      if (stored + bytes.length > quota * MB) throw overQuota(quota, stored, bytes.length);
      // Kept before the row commits; on a rollback the object is named by no row, and harmless.
      const storageKey = await keepFile(this.files, bytes);
      const added = await this.repo.add(
        {
          ingredientId: ingredient.id,
          filename: withExtension(filename, ACCEPTED_SPECIFICATION_TYPES[type.mime], 'specification'),
          mediaType: type.mime,
          sizeBytes: bytes.length,
          sha256: storageKey,
          storageKey,
          reviewBy,
          note: parsed.data.note ?? '',
          uploadedBy: userId,
        },
        t,
      );
      await this.audit.record(
        {
          action: 'specification.uploaded',
          record: { kind: 'ingredient', id: ingredient.code },
          summary: `Uploaded the supplier specification ${added.filename} for ${ingredient.code}, to review by ${reviewBy}${parsed.data.reviewBy ? '' : ' (one year from today, as none was given)'}.`,
          after: {
            specification: added.id,
            filename: added.filename,
            mediaType: added.mediaType,
            sizeBytes: added.sizeBytes,
            sha256: added.sha256,
            reviewBy,
            note: parsed.data.note ?? '',
          },
        },
        t,
      );
      return added;
    });
    return view(row, ingredient.code, true, this.today(), await this.uploaders());
  }

  /** Every version, newest first. */
  async list(code: string): Promise<SpecificationView[]> {
    const ingredient = await this.ingredient(code);
    const rows = await this.repo.listFor([ingredient.id]);
    const now = this.today();
    const uploaders = await this.uploaders();
    return rows.map((r, i) => view(r, ingredient.code, i === 0, now, uploaders));
  }

  /**
   * The stored bytes, to download (never shown in the API's own origin), with the type found at
   * upload and a name ending in its extension, cleaned again in case it was stored before.
   */
  async file(id: string): Promise<StreamableFile> {
    const n = /^\d{1,9}$/.test(id) ? Number(id) : NaN;
    const found = Number.isNaN(n) ? null : await this.repo.findFile(n);
    if (!found) throw new AppError('not-found', `There is no specification ${id}.`);
    const content = await readStoredFile(this.files, found.storageKey, found.sha256, `specification ${id} (${found.filename})`);
    return new StreamableFile(content, {
      type: found.mediaType,
      length: content.length,
      disposition: contentDisposition(
        withExtension(safeFilename(found.filename), ACCEPTED_SPECIFICATION_TYPES[found.mediaType] ?? 'bin', 'specification'),
      ),
    });
  }

  /** For every ingredient: its newest specification, and whether it is missing, overdue or current. */
  async status(): Promise<SpecificationStatus[]> {
    const ingredients = await this.ingredients.listHeads((await this.kitchen.owner()).id);
    const rows = await this.repo.listFor(ingredients.map((i) => i.id));
    const latest = newest(rows);
    const now = this.today();
    return ingredients.map((i) => {
      const r = latest.get(i.id);
      return {
        ingredient: i.code,
        name: i.name,
        latest: r ? { id: r.id, version: r.version, reviewBy: r.reviewBy, uploadedAt: r.createdAt.toISOString() } : null,
        state: !r ? 'missing' : r.reviewBy < now ? 'overdue' : 'current',
      };
    });
  }

  /**
   * The newest specification of every ingredient whose review-by date has passed (overdue) or
   * comes within `withinDays` days (due soon), counted from the kitchen's date at `now`.
   */
  async reviewsDue(now = this.clock.now(), withinDays = REVIEW_WINDOW_DAYS): Promise<ReviewsDue> {
    const day = today(now);
    const ingredients = await this.ingredients.listHeads((await this.kitchen.owner()).id);
    const latest = newest(await this.repo.listFor(ingredients.map((i) => i.id)));
    const horizon = addDays(day, withinDays);
    const reviews: SpecificationReview[] = ingredients.flatMap((i) => {
      const r = latest.get(i.id);
      if (!r || r.reviewBy > horizon) return [];
      return [
        {
          ingredient: i.code,
          name: i.name,
          specification: r.id,
          version: r.version,
          reviewBy: r.reviewBy,
          daysLeft: daysBetween(day, r.reviewBy),
        },
      ];
    });
    const byDate = (a: SpecificationReview, b: SpecificationReview) => a.reviewBy.localeCompare(b.reviewBy) || a.name.localeCompare(b.name);
    return {
      today: day,
      withinDays,
      overdue: reviews.filter((r) => r.reviewBy < day).sort(byDate),
      dueSoon: reviews.filter((r) => r.reviewBy >= day).sort(byDate),
    };
  }

  /**
   * For the ingredients with these head ids, in one query: the newest specification's review-by
   * date of each that has one, and today's date on the kitchen's calendar, to compare it with.
   * Worked out as it is asked, never kept.
   */
  async standing(ingredients: readonly { rowId: number }[]): Promise<{ today: string; reviewBy: Map<number, string> }> {
    const latest = newest(await this.repo.listFor([...new Set(ingredients.map((i) => i.rowId))]));
    return { today: this.today(), reviewBy: new Map([...latest].map(([rowId, r]) => [rowId, r.reviewBy])) };
  }
}

/** What `standing` answers: today's date and each ingredient's newest review-by date (by head id). */
export type SpecificationStanding = Awaited<ReturnType<SpecificationsService['standing']>>;

/** A warning for each ingredient whose newest specification's review-by date is before today. */
export function overdueWarnings(
  ingredients: readonly { rowId: number; id: string; name: string }[],
  { today: day, reviewBy }: SpecificationStanding,
): Map<string, SpecificationReviewWarning> {
  const warnings = new Map<string, SpecificationReviewWarning>();
  for (const i of ingredients) {
    const due = reviewBy.get(i.rowId);
    if (due === undefined || due >= day) continue;
    warnings.set(i.id, {
      ingredient: i.id,
      name: i.name,
      reviewBy: due,
      message: `The supplier specification of ${i.name} was due for review on ${due}; this declaration uses what it recorded. Check it against the supplier's current specification.`,
    });
  }
  return warnings;
}

/**
 * What a product's claims stand on, from its leaf ingredients (distinct, in the order reached):
 * how many were checked, and which rest on a supplier statement alone because no specification is
 * on file or the newest is past its review-by date today. A leaf that is no longer an ingredient
 * of the kitchen (an approved declaration's copy) has no specification on file.
 */
export function claimBasisOf(
  leaves: readonly { rowId: number | null; id: string; name: string }[],
  { today: day, reviewBy }: SpecificationStanding,
): ClaimBasis {
  const distinct = [...new Map(leaves.map((l) => [l.id, l])).values()];
  const statementOnly = distinct.flatMap((l): StatementOnlyLeaf[] => {
    const due = l.rowId === null ? undefined : reviewBy.get(l.rowId);
    if (due === undefined) return [{ id: l.id, name: l.name, why: 'no-specification' }];
    return due < day ? [{ id: l.id, name: l.name, why: 'review-overdue', reviewBy: due }] : [];
  });
  return { checked: distinct.length, statementOnly };
}

/** How far ahead the reviews-due list and its daily mail look. */
export const REVIEW_WINDOW_DAYS = 30;

/** The newest specification of each ingredient (rows come newest version first for each). */
function newest(rows: SpecificationRow[]): Map<number, SpecificationRow> {
  const latest = new Map<number, SpecificationRow>();
  for (const r of rows) if (!latest.has(r.ingredientId)) latest.set(r.ingredientId, r);
  return latest;
}

/** Calendar days from one YYYY-MM-DD to another. */
function daysBetween(from: string, to: string): number {
  return Math.round((Date.parse(`${to}T00:00:00Z`) - Date.parse(`${from}T00:00:00Z`)) / 86_400_000);
}

function view(r: SpecificationRow, ingredient: string, current: boolean, now: string, uploaders: Map<number, string>): SpecificationView {
  return {
    id: r.id,
    ingredient,
    version: r.version,
    filename: r.filename,
    mediaType: r.mediaType,
    sizeBytes: r.sizeBytes,
    sha256: r.sha256,
    reviewBy: r.reviewBy,
    note: r.note,
    uploadedBy: r.uploadedBy !== null && uploaders.has(r.uploadedBy) ? { id: r.uploadedBy, name: uploaders.get(r.uploadedBy)! } : null,
    uploadedAt: r.createdAt.toISOString(),
    current,
    reviewOverdue: r.reviewBy < now,
    fileUrl: `/api/specifications/${r.id}/file`,
  };
}

const MB = 1024 * 1024;

const size = (bytes: number) =>
  bytes < 1024 ? `${bytes} bytes` : bytes < MB ? `${Math.ceil(bytes / 1024)} KB` : `${Math.round((bytes / MB) * 10) / 10} MB`;

function overQuota(quotaMb: number, stored: number, adding: number): AppError {
  const limit = `the kitchen's specification files may take at most ${quotaMb} MB in all (the setting KITCHEN_FILE_QUOTA_MB)`;
  const message = `Nothing was saved: ${limit}; they take ${size(stored)} already, and this file is ${size(adding)}.`;
  return new AppError('too-large', message, [{ path: 'file', message: `This file would take the kitchen past its ${quotaMb} MB.` }]);
}

/** attachment (RFC 6266), with an ASCII fallback name and the exact name in RFC 5987 form. */
export function contentDisposition(filename: string): string {
  const ascii = filename.replace(/[^\x20-\x7e]/g, '_').replace(/["\\;]/g, '_');
  return `attachment; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(filename).replace(/['()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`)}`;
}
