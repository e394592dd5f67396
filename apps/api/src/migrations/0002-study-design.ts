import { DataTypes, QueryTypes, type QueryInterface } from 'sequelize';

/** The fundamental frequency given to a study saved without a load (the previous release had no other). */
export const DEFAULT_FUNDAMENTAL_FREQUENCY = 50;

type Json = Record<string, unknown>;

/** A stored revision as the previous release wrote it (services/studies.ts before migration 0002). */
export interface PreviousRevision {
  method: string;
  /** The modulation without its method: vdc, mf or frequencyRatio, and the method's fields (three-phase ones with `output`). */
  parameters: Json;
  /** `{ r, l, frequency, emf? }` or null. */
  load: Json | null;
  /** `{ l, c, rDamping?, dampingPlacement?, cDamping?, loadR? }` or null. */
  filter: Json | null;
}

/**
 * The InverterDesign of a revision saved by the previous release, which stored a modulation
 * (with vdc and the frequency ratio), an optional load with its frequency, and an optional filter
 * with an optional resistive load of its own:
 * - modulation: the old one without vdc, mf, frequencyRatio and `output` (which voltage spectra
 *   analysed: the report shows every voltage, so it goes);
 * - fundamentalFrequency: the load's frequency, else 50 Hz (DEFAULT_FUNDAMENTAL_FREQUENCY);
 * - carrierFrequency: mf (or frequencyRatio) × fundamentalFrequency, for the carrier methods;
 * - load: the old load without its frequency; with none, a filter's loadR becomes a resistive load
 *   { r: loadR, l: 0 }; with one, loadR is left out of the design (the design has one load), and the
 *   old columns keep it, so nothing saved is lost.
 * Written out here, not imported from the library, so the migration stays what it was when it ran.
 */
export function designOfPreviousRevision(row: PreviousRevision): Json {
  const { vdc, mf, frequencyRatio, output: _output, ...modulation } = row.parameters;
  const oldLoad = row.load;
  const fundamentalFrequency =
    typeof oldLoad?.frequency === 'number' ? oldLoad.frequency : DEFAULT_FUNDAMENTAL_FREQUENCY;
  const ratio =
    typeof mf === 'number' ? mf : typeof frequencyRatio === 'number' ? frequencyRatio : undefined;
  const design: Json = {
    vdc,
    fundamentalFrequency,
    ...(ratio === undefined ? {} : { carrierFrequency: ratio * fundamentalFrequency }),
    modulation: { method: row.method, ...modulation },
  };
  let filterLoad: Json | null = null;
  if (row.filter) {
    const { loadR, ...filter } = row.filter;
    design.filter = filter;
    if (typeof loadR === 'number') filterLoad = { r: loadR, l: 0 };
  }
  if (oldLoad) {
    const { frequency: _frequency, ...load } = oldLoad;
    design.load = load;
  } else if (filterLoad) {
    design.load = filterLoad;
  }
  return design;
}

/** JSON columns come back as text from SQLite and as values from PostgreSQL. */
function json(value: unknown): Json | null {
  if (value === null || value === undefined) return null;
  return (typeof value === 'string' ? JSON.parse(value) : value) as Json | null;
}

/**
 * Studies store one InverterDesign per revision (issue 9): adds `design` to study_revisions and
 * fills it from each row's old columns, which stay as they were. Frozen once released.
 */
export async function up({ context: q }: { context: QueryInterface }): Promise<void> {
  const columns = await q.describeTable('study_revisions');
  // Idempotent: a run stopped after adding the column (no migration record yet) can run again.
  if (!('design' in columns))
    await q.addColumn('study_revisions', 'design', { type: DataTypes.JSON, allowNull: true });
  const sequelize = q.sequelize;
  await sequelize.transaction(async (transaction) => {
    const rows = await sequelize.query<{
      id: string;
      method: string;
      parameters: unknown;
      load: unknown;
      filter: unknown;
    }>('SELECT "id", "method", "parameters", "load", "filter" FROM "study_revisions"', {
      type: QueryTypes.SELECT,
      transaction,
    });
    for (const row of rows) {
      const design = designOfPreviousRevision({
        method: row.method,
        parameters: json(row.parameters) ?? {},
        load: json(row.load),
        filter: json(row.filter),
      });
      await sequelize.query('UPDATE "study_revisions" SET "design" = :design WHERE "id" = :id', {
        replacements: { design: JSON.stringify(design), id: row.id },
        transaction,
      });
    }
  });
}

export async function down({ context: q }: { context: QueryInterface }): Promise<void> {
  await q.removeColumn('study_revisions', 'design');
}
