import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import type { Handling, MeasureSystem, Regime, Substitution } from '@crumbproof/shared';
import type { Transaction } from 'sequelize';
import { deepFreeze } from '../common/deep-freeze';
import { parseJson } from '../common/json-column';
import { ChangeFeed, KeptUntilChanged } from '../database/change-feed';
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
 * Every write raises a version of the kitchen's row (lock, update) and tells the change feed, so
 * this instance's copies of the book go at once and every other instance's within CHANGE_STALE_MS.
 */
@Injectable()
export class SiteRepository {
  /** Every kitchen as the requests last read them (see allAtRequest). */
  private readonly kept: KeptUntilChanged<'all', readonly SiteRow[]>;

  constructor(
    @InjectModel(SiteModel) private readonly sites: typeof SiteModel,
    private readonly feed: ChangeFeed,
  ) {
    this.kept = new KeptUntilChanged(feed, 'book');
  }

  /** The book's owner: the first kitchen set up, or null before any is. */
  async first(t?: Transaction): Promise<SiteRow | null> {
    const row = await this.sites.findOne({ order: [['id', 'ASC']], transaction: t });
    return row ? toRow(row) : null;
  }

  /** Every kitchen, in the order they were set up (the owner first). */
  async all(t?: Transaction): Promise<SiteRow[]> {
    return (await this.sites.findAll({ order: [['id', 'ASC']], transaction: t })).map(toRow);
  }

  /**
   * Every kitchen as all does, outside a write: this instance's copy (frozen, shared by every
   * request) while no kitchen write has been heard (ChangeFeed polls every kitchen's versions), else read again.
   */
  allAtRequest(): Promise<readonly SiteRow[]> {
    return this.kept.get('all', async () => deepFreeze(await this.all()));
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
    this.feed.bookChanged(t);
  }

  async create(settings: SiteSettings, t?: Transaction): Promise<SiteRow> {
    const created = toRow(await this.sites.create({ ...settings }, { transaction: t }));
    this.feed.bookChanged(t);
    return created;
  }

  /** Changes the settings and raises the version, so every declaration computed from the old ones is recomputed. */
  async update(id: number, changes: Partial<SiteSettings>, t?: Transaction): Promise<SiteRow> {
    const row = await this.sites.findByPk(id, { transaction: t, lock: t ? t.LOCK.UPDATE : undefined });
    if (!row) throw new Error(`There is no site ${id}.`);
    await row.update({ ...changes, version: row.version + 1 }, { transaction: t });
    this.feed.bookChanged(t);
    return toRow(row);
  }
}
