import { QueryTypes, type QueryInterface } from 'sequelize';

/** The first release's names of the discontinuous zero sequences → the trade's DPWM names (docs/methods.md, glossary). */
export const DPWM_NAMES: Readonly<Record<string, string>> = {
  'clamp-60-peak': 'dpwm1',
  'clamp-60-lead': 'dpwm0',
  'clamp-60-lag': 'dpwm2',
  'clamp-120-top': 'dpwm-max',
  'clamp-120-bottom': 'dpwm-min',
};

type Json = Record<string, unknown>;

/** JSON columns come back as text from SQLite and as values from PostgreSQL. */
function json(value: unknown): Json | null {
  if (value === null || value === undefined) return null;
  return (typeof value === 'string' ? JSON.parse(value) : value) as Json | null;
}

/**
 * One vocabulary (issue 9): the carrier zero sequences take the DPWM names the space-vector
 * clamping already uses. Renames `modulation.zeroSequence` in each revision's `design`; the first
 * release's columns (`parameters`) stay as they were written. Frozen once released.
 */
export async function up({ context: q }: { context: QueryInterface }): Promise<void> {
  const sequelize = q.sequelize;
  await sequelize.transaction(async (transaction) => {
    const rows = await sequelize.query<{ id: string; design: unknown }>(
      'SELECT "id", "design" FROM "study_revisions"',
      {
        type: QueryTypes.SELECT,
        transaction,
      },
    );
    for (const row of rows) {
      const design = json(row.design);
      const modulation = design?.modulation as Json | undefined;
      const renamed =
        typeof modulation?.zeroSequence === 'string'
          ? DPWM_NAMES[modulation.zeroSequence]
          : undefined;
      if (design === null || modulation === undefined || renamed === undefined) continue;
      const updated = { ...design, modulation: { ...modulation, zeroSequence: renamed } };
      await sequelize.query('UPDATE "study_revisions" SET "design" = :design WHERE "id" = :id', {
        replacements: { design: JSON.stringify(updated), id: row.id },
        transaction,
      });
    }
  });
}

/** Back to the first release's names. */
export async function down({ context: q }: { context: QueryInterface }): Promise<void> {
  const back = Object.fromEntries(
    Object.entries(DPWM_NAMES).map(([old, current]) => [current, old]),
  );
  const rows = await q.sequelize.query<{ id: string; design: unknown }>(
    'SELECT "id", "design" FROM "study_revisions"',
    {
      type: QueryTypes.SELECT,
    },
  );
  for (const row of rows) {
    const design = json(row.design);
    const modulation = design?.modulation as Json | undefined;
    const renamed =
      typeof modulation?.zeroSequence === 'string' ? back[modulation.zeroSequence] : undefined;
    if (design === null || modulation === undefined || renamed === undefined) continue;
    await q.sequelize.query('UPDATE "study_revisions" SET "design" = :design WHERE "id" = :id', {
      replacements: {
        design: JSON.stringify({ ...design, modulation: { ...modulation, zeroSequence: renamed } }),
        id: row.id,
      },
    });
  }
}
