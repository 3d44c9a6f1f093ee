import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import type { Declaration, ProductDeclaration, Regime } from '@crumbproof/shared';
import { Op, UniqueConstraintError, type Sequelize } from 'sequelize';
import { parseJson } from '../common/json-column';
import { statementChunks } from '../common/statement-chunks';
import { DeclarationModel } from './declaration.model';

/** A declaration as kept: what it declares and when it was computed. */
export interface KeptDeclaration {
  /** The row's id (an approval names the declaration it approves by it). */
  id: number;
  body: ProductDeclaration;
  computedAt: Date;
}

export interface NewDeclaration {
  /** The recipe's row id. */
  recipeId: number;
  recipeRevision: number;
  regime: Regime;
  inputHash: string;
  body: ProductDeclaration;
}

/** Declarations kept per statement by addMany, at most (and within STATEMENT_BODY_BYTES). */
const ADD_CHUNK = 200;

/** The only place that reads and writes the declarations table. */
@Injectable()
export class DeclarationsRepository {
  constructor(@InjectModel(DeclarationModel) private readonly declarations: typeof DeclarationModel) {}

  async find(recipeId: number, regime: Regime, inputHash: string): Promise<KeptDeclaration | null> {
    const row = await this.declarations.findOne({ where: { recipeId, regime, inputHash } });
    return row ? { id: row.id as number, body: parseJson(row.body) as ProductDeclaration, computedAt: row.createdAt } : null;
  }

  /** The kept declarations of several recipes under one regime, by `${recipeId} ${inputHash}`; one query. */
  async findMany(regime: Regime, keys: readonly { recipeId: number; inputHash: string }[]): Promise<Map<string, KeptDeclaration>> {
    const out = new Map<string, KeptDeclaration>();
    if (keys.length === 0) return out;
    const rows = await this.declarations.findAll({
      where: { regime, inputHash: { [Op.in]: [...new Set(keys.map((k) => k.inputHash))] } },
    });
    const wanted = new Set(keys.map((k) => `${k.recipeId} ${k.inputHash}`));
    for (const row of rows) {
      const key = `${row.recipeId} ${row.inputHash}`;
      if (wanted.has(key) && !out.has(key))
        out.set(key, { id: row.id as number, body: parseJson(row.body) as ProductDeclaration, computedAt: row.createdAt });
    }
    return out;
  }

  /** Which of several recipes' declarations under one regime are kept, by `${recipeId} ${inputHash}`; one query, no bodies read. */
  async existing(regime: Regime, keys: readonly { recipeId: number; inputHash: string }[]): Promise<Set<string>> {
    const out = new Set<string>();
    if (keys.length === 0) return out;
    const rows = await this.declarations.findAll({
      where: { regime, inputHash: { [Op.in]: [...new Set(keys.map((k) => k.inputHash))] } },
      attributes: ['recipeId', 'inputHash'],
    });
    const wanted = new Set(keys.map((k) => `${k.recipeId} ${k.inputHash}`));
    for (const row of rows) if (wanted.has(`${row.recipeId} ${row.inputHash}`)) out.add(`${row.recipeId} ${row.inputHash}`);
    return out;
  }

  /** Keeps a declaration; when the same one was kept at the same moment elsewhere, that one is the one kept. */
  async add(values: NewDeclaration): Promise<KeptDeclaration> {
    try {
      const row = await this.declarations.create({ ...values });
      return { id: row.id as number, body: values.body, computedAt: row.createdAt };
    } catch (e) {
      if (!(e instanceof UniqueConstraintError)) throw e;
      const kept = await this.find(values.recipeId, values.regime, values.inputHash);
      if (!kept) throw e;
      return kept;
    }
  }

  /**
   * Keeps many declarations in a few statements, by `${recipeId} ${inputHash}`. One kept at the
   * same moment elsewhere stands (its inputs are the same, so it declares the same) and is the one
   * given back.
   */
  async addMany(values: readonly NewDeclaration[]): Promise<Map<string, KeptDeclaration>> {
    const out = new Map<string, KeptDeclaration>();
    // Each body is made JSON once and sent as a parameter of a prepared statement, which the driver
    // writes as its bytes, where a statement sent as text escapes every character of megabytes of
    // JSON in script (half the time of an import's writes, measured).
    const rows = values.map((v) => ({ ...v, json: JSON.stringify(v.body) }));
    const sequelize = this.declarations.sequelize;
    if (!sequelize) throw new Error('The declarations table is not connected');
    for (const chunk of statementChunks(rows, (r) => Buffer.byteLength(r.json, 'utf8'), ADD_CHUNK)) {
      const now = new Date();
      const tuples = chunk.map(() => '(?, ?, ?, ?, ?, ?)');
      await executePrepared(
        sequelize,
        `INSERT IGNORE INTO declarations (recipe_id, recipe_revision, regime, input_hash, body, created_at) VALUES ${tuples.join(', ')}`,
        chunk.flatMap((r) => [r.recipeId, r.recipeRevision, r.regime, r.inputHash, r.json, now]),
      );
      const kept = await this.declarations.findAll({
        where: { regime: chunk[0].regime, inputHash: { [Op.in]: [...new Set(chunk.map((v) => v.inputHash))] } },
        attributes: ['id', 'recipeId', 'inputHash', 'createdAt'],
      });
      const bodies = new Map(chunk.map((v) => [`${v.recipeId} ${v.inputHash}`, v.body]));
      for (const row of kept) {
        const key = `${row.recipeId} ${row.inputHash}`;
        const body = bodies.get(key);
        if (body && !out.has(key)) out.set(key, { id: row.id as number, body, computedAt: row.createdAt });
      }
    }
    return out;
  }

  /** The first declaration kept for each revision of a recipe under a regime. */
  async firstOfEachRevision(recipeId: number, regime: Regime): Promise<Map<number, Declaration>> {
    const rows = await this.declarations.findAll({ where: { recipeId, regime }, order: [['id', 'ASC']] });
    const out = new Map<number, Declaration>();
    for (const r of rows) if (!out.has(r.recipeRevision)) out.set(r.recipeRevision, parseJson(r.body) as Declaration);
    return out;
  }
}

/**
 * Runs a statement as a prepared one on a connection of the pool (MariaDB's binary protocol: each
 * value goes as its bytes, nothing escaped). Sequelize sends every statement as text.
 */
async function executePrepared(sequelize: Sequelize, sql: string, values: unknown[]): Promise<void> {
  const pool = sequelize.connectionManager;
  const connection = (await pool.getConnection({ type: 'write' })) as PreparingConnection;
  try {
    await connection.execute(sql, values);
  } finally {
    pool.releaseConnection(connection);
  }
}

/** A pooled connection of the mariadb driver, as Sequelize's pool gives it. */
interface PreparingConnection {
  execute(sql: string, values: unknown[]): Promise<unknown>;
}
