import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrator';

/**
 * A counter on the kitchen's row raised by every write made under the kitchen's lock (an
 * ingredient or recipe saved, an import, a swap, a specification, an approval). With the settings'
 * version it names one state of everything a declaration is served from, so a copy of the kitchen
 * read for one request can be reused by the next until either changes, on every API instance.
 */
export async function up({ sequelize }: MigrationContext) {
  await sequelize.getQueryInterface().addColumn('sites', 'book_version', { type: DataTypes.BIGINT, allowNull: false, defaultValue: 0 });
}

export async function down({ sequelize }: MigrationContext) {
  await sequelize.getQueryInterface().removeColumn('sites', 'book_version');
}
