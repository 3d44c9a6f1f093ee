import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import type { Transaction } from 'sequelize';
import { IngredientModel } from '../ingredients/ingredient.model';
import { UserModel } from '../users/user.model';
import { SpecificationModel } from './specification.model';

export interface NewSpecification {
  ingredientId: number;
  filename: string;
  mediaType: string;
  sizeBytes: number;
  sha256: string;
  content: Buffer;
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
  uploadedBy: { id: number; name: string } | null;
  createdAt: Date;
}

export interface IngredientRef {
  id: number;
  code: string;
  name: string;
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
    uploadedBy: m.uploader ? { id: m.uploader.id as number, name: m.uploader.name } : null,
    createdAt: m.createdAt,
  };
}

/** The only place that reads and writes supplier specifications. */
@Injectable()
export class SpecificationsRepository {
  constructor(
    @InjectModel(SpecificationModel) private readonly specs: typeof SpecificationModel,
    @InjectModel(IngredientModel) private readonly ingredients: typeof IngredientModel,
  ) {}

  async findIngredient(siteId: number, code: string): Promise<IngredientRef | null> {
    const row = await this.ingredients.findOne({ where: { siteId, code, archived: false }, attributes: ['id', 'code', 'name'] });
    return row ? { id: row.id, code: row.code, name: row.name } : null;
  }

  async listIngredients(siteId: number): Promise<IngredientRef[]> {
    const rows = await this.ingredients.findAll({
      where: { siteId, archived: false },
      attributes: ['id', 'code', 'name'],
      order: [['name', 'ASC']],
    });
    return rows.map((r) => ({ id: r.id, code: r.code, name: r.name }));
  }

  /** Adds the next version for the ingredient; the ingredient row is locked so versions never collide. */
  async add(values: NewSpecification, t: Transaction): Promise<SpecificationRow> {
    await this.ingredients.findByPk(values.ingredientId, { attributes: ['id'], transaction: t, lock: t.LOCK.UPDATE });
    const last =
      (await this.specs.max<number, SpecificationModel>('version', { where: { ingredientId: values.ingredientId }, transaction: t })) ?? 0;
    const created = await this.specs.create({ ...values, version: Number(last) + 1 }, { transaction: t });
    return this.findMetadata(created.id, t) as Promise<SpecificationRow>;
  }

  async findMetadata(id: number, t?: Transaction): Promise<SpecificationRow | null> {
    const row = await this.specs.findByPk(id, {
      attributes: METADATA,
      include: [{ model: UserModel, attributes: ['id', 'name'] }],
      transaction: t,
    });
    return row ? toRow(row) : null;
  }

  /** Every version for these ingredients, newest first, without the bytes. */
  async listFor(ingredientIds: number[]): Promise<SpecificationRow[]> {
    if (ingredientIds.length === 0) return [];
    const rows = await this.specs.findAll({
      where: { ingredientId: ingredientIds },
      attributes: METADATA,
      include: [{ model: UserModel, attributes: ['id', 'name'] }],
      order: [
        ['ingredientId', 'ASC'],
        ['version', 'DESC'],
      ],
    });
    return rows.map(toRow);
  }

  async findFile(id: number): Promise<{ filename: string; mediaType: string; content: Buffer } | null> {
    const row = await this.specs.findByPk(id, { attributes: ['id', 'filename', 'mediaType', 'content'] });
    return row ? { filename: row.filename, mediaType: row.mediaType, content: row.content } : null;
  }
}
