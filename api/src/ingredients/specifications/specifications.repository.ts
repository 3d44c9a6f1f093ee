import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import { QueryTypes, type Transaction } from 'sequelize';
import { SpecificationModel } from './specification.model';

export interface NewSpecification {
  ingredientId: number;
  filename: string;
  mediaType: string;
  sizeBytes: number;
  sha256: string;
  /** The file's key in the FileStore, put there before this row's transaction commits. */
  storageKey: string;
  reviewBy: string;
  note: string;
  uploadedBy: number | null;
}

export interface SpecificationRow {
  id: number;
  ingredientId: number;
  version: number;
  filename: string;
  mediaType: string;
  sizeBytes: number;
  sha256: string;
  reviewBy: string;
  note: string;
  /** The uploader's user id. */
  uploadedBy: number | null;
  createdAt: Date;
}

/** Everything but the bytes. */
const METADATA = [
  'id',
  'ingredientId',
  'version',
  'filename',
  'mediaType',
  'sizeBytes',
  'sha256',
  'reviewBy',
  'note',
  'uploadedBy',
  'createdAt',
];

function toRow(m: SpecificationModel): SpecificationRow {
  return {
    id: m.id,
    ingredientId: m.ingredientId,
    version: m.version,
    filename: m.filename,
    mediaType: m.mediaType,
    sizeBytes: m.sizeBytes,
    sha256: m.sha256,
    reviewBy: String(m.reviewBy),
    note: m.note,
    uploadedBy: m.uploadedBy,
    createdAt: m.createdAt,
  };
}

/** The only place that reads and writes supplier specifications. */
@Injectable()
export class SpecificationsRepository {
  constructor(@InjectModel(SpecificationModel) private readonly specs: typeof SpecificationModel) {}

  /** Adds the next version for the ingredient; the caller holds the ingredient's row lock, so versions never collide. */
  async add(values: NewSpecification, t: Transaction): Promise<SpecificationRow> {
    const last =
      (await this.specs.max<number, SpecificationModel>('version', { where: { ingredientId: values.ingredientId }, transaction: t })) ?? 0;
    const created = await this.specs.create({ ...values, version: Number(last) + 1 }, { transaction: t });
    return this.findMetadata(created.id, t) as Promise<SpecificationRow>;
  }

  /** The bytes that the specification files of this kitchen's ingredients (archived ones too) take. */
  async storedBytes(siteId: number, t?: Transaction): Promise<number> {
    const row = await this.specs.sequelize!.query<{ bytes: number | string | null }>(
      'SELECT COALESCE(SUM(s.size_bytes), 0) AS bytes FROM specifications s JOIN ingredients i ON i.id = s.ingredient_id WHERE i.site_id = ?',
      { replacements: [siteId], type: QueryTypes.SELECT, plain: true, transaction: t },
    );
    return Number(row?.bytes ?? 0);
  }

  async findMetadata(id: number, t?: Transaction): Promise<SpecificationRow | null> {
    const row = await this.specs.findByPk(id, { attributes: METADATA, transaction: t });
    return row ? toRow(row) : null;
  }

  /** Every version for these ingredients, newest first, without the bytes. */
  async listFor(ingredientIds: number[]): Promise<SpecificationRow[]> {
    if (ingredientIds.length === 0) return [];
    const rows = await this.specs.findAll({
      where: { ingredientId: ingredientIds },
      attributes: METADATA,
      order: [
        ['ingredientId', 'ASC'],
        ['version', 'DESC'],
      ],
    });
    return rows.map(toRow);
  }

  async findFile(id: number): Promise<{ filename: string; mediaType: string; storageKey: string; sha256: string } | null> {
    const row = await this.specs.findByPk(id, { attributes: ['id', 'filename', 'mediaType', 'storageKey', 'sha256'] });
    return row ? { filename: row.filename, mediaType: row.mediaType, storageKey: row.storageKey, sha256: row.sha256 } : null;
  }
}
