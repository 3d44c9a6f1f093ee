import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import type { Handling, MeasureSystem, Regime, Substitution } from '@crumbproof/shared';
import type { Transaction } from 'sequelize';
import { parseJson } from '../common/json-column';
import { SiteModel } from './site.model';

/** A kitchen as stored: its settings and their version (raised by every change to them). */
export interface SiteRow {
  id: number;
  /** Its id in the recipe book; null for the one kitchen of a book given as site. */
  code: string | null;
  name: string;
  address: string;
  regime: Regime;
  measures: MeasureSystem | null;
  handles: Handling[];
  substitutions: Substitution[];
  /** The recipes for sale this kitchen sells; null: every one. */
  sells: string[] | null;
  version: number;
  /**
   * Raised by every write under the kitchen's lock: with `version`, it names one state of the
   * kitchen's items, specifications and approvals (see BooksService.state).
   */
  bookVersion: number;
}

export type SiteSettings = Pick<SiteRow, 'name' | 'address' | 'regime' | 'measures' | 'handles'> &
  Partial<Pick<SiteRow, 'code' | 'substitutions' | 'sells'>>;

function toRow(m: SiteModel): SiteRow {
  return {
    id: m.id as number,
    code: m.code ?? null,
    name: m.name,
    address: m.address,
    regime: m.regime,
    measures: m.measures,
    handles: parseJson(m.handles),
    substitutions: parseJson(m.substitutions ?? []),
    sells: m.sells === null || m.sells === undefined ? null : parseJson(m.sells),
    version: m.version,
    bookVersion: Number(m.bookVersion),
  };
}

/**
 * The only place that reads and writes the sites table: the installation's kitchens. The first one
 * set up owns the recipe book (ingredient and recipe rows are keyed by it) and holds its lock.
 */
@Injectable()
export class SiteRepository {
  constructor(@InjectModel(SiteModel) private readonly sites: typeof SiteModel) {}

  /** The book's owner: the first kitchen set up, or null before any is. */
  async first(t?: Transaction): Promise<SiteRow | null> {
    const row = await this.sites.findOne({ order: [['id', 'ASC']], transaction: t });
    return row ? toRow(row) : null;
  }

  /** Every kitchen, in the order they were set up (the owner first). */
  async all(t?: Transaction): Promise<SiteRow[]> {
    return (await this.sites.findAll({ order: [['id', 'ASC']], transaction: t })).map(toRow);
  }

  async byId(id: number, t?: Transaction): Promise<SiteRow | null> {
    const row = await this.sites.findByPk(id, { transaction: t });
    return row ? toRow(row) : null;
  }

  /**
   * Locks the kitchen's row until the transaction ends, so kitchen writes happen one at a time,
   * and raises its book version: a write that commits changes the version every reader compares,
   * and one that is rolled back takes its raise with it.
   */
  async lock(t: Transaction): Promise<void> {
    const first = await this.sites.findOne({ attributes: ['id'], order: [['id', 'ASC']], transaction: t, lock: t.LOCK.UPDATE });
    if (first) await this.sites.increment('bookVersion', { by: 1, where: { id: first.id }, transaction: t });
  }

  async create(settings: SiteSettings, t?: Transaction): Promise<SiteRow> {
    return toRow(await this.sites.create({ ...settings }, { transaction: t }));
  }

  /** Changes the settings and raises the version, so every declaration computed from the old ones is recomputed. */
  async update(id: number, changes: Partial<SiteSettings>, t?: Transaction): Promise<SiteRow> {
    const row = await this.sites.findByPk(id, { transaction: t, lock: t ? t.LOCK.UPDATE : undefined });
    if (!row) throw new Error(`There is no site ${id}.`);
    await row.update({ ...changes, version: row.version + 1 }, { transaction: t });
    return toRow(row);
  }
}
