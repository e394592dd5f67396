import {
  designCarrierSpan,
  designModulation,
  designSpanModulation,
  type InverterDesign,
} from '@pulsewright/modulation';
import { col, Op, Transaction, UniqueConstraintError } from 'sequelize';
import type { Models, StudyRevisionRow, StudyRow } from '../models/index.js';
import { conflict, notFound } from '../http/errors.js';
import type { AuditLog } from './audit.js';
import { iso } from './dto.js';
import type { Principal } from './principal.js';
import { containsText, type ProjectService } from './projects.js';

/** The content of one revision as the API reads and writes it: a name, the design, a note. */
export interface StudyContent {
  name: string;
  design: InverterDesign;
  note?: string;
}

export interface StudyDto {
  id: string;
  projectId: string;
  revision: number;
  name: string;
  method: string;
  design: InverterDesign;
  note: string;
  createdAt: string;
  updatedAt: string;
}

export interface StudyRevisionDto {
  revision: number;
  name: string;
  design: InverterDesign;
  note: string;
  authorEmail: string | null;
  restoredFrom: number | null;
  createdAt: string;
}

/**
 * Studies with full history: every save inserts a revision row, nothing is overwritten, a
 * restore copies an old revision forward. Saves name the revision they were based on
 * (optimistic concurrency): a save based on anything but the current revision is refused
 * with 409, and the unique (studyId, revision) index stops two saves from both becoming n + 1.
 */
export class StudyService {
  constructor(
    private readonly models: Models,
    private readonly audit: AuditLog,
    private readonly projects: ProjectService,
  ) {}

  private transaction<T>(work: (t: Transaction) => Promise<T>): Promise<T> {
    // IMMEDIATE takes SQLite's write lock at BEGIN, so two writers queue on the busy timeout
    // instead of deadlocking on a read-to-write upgrade; PostgreSQL ignores the type.
    return this.models.sequelize.transaction({ type: Transaction.TYPES.IMMEDIATE }, work);
  }

  async list(
    teamId: string,
    filter: { projectId?: string; q?: string; limit: number; offset: number },
  ): Promise<StudyDto[]> {
    const and: unknown[] = [];
    if (filter.q) {
      and.push({
        [Op.or]: [
          containsText(this.models.sequelize, 'Study.name', filter.q),
          containsText(this.models.sequelize, 'Study.method', filter.q),
        ],
      });
    }
    // One query: each study joined to its current revision (exactly one row each, by the
    // unique (studyId, revision) index), so no subquery is needed around the limit.
    const studies = (await this.models.Study.findAll({
      where: {
        teamId,
        ...(filter.projectId ? { projectId: filter.projectId } : {}),
        ...(and.length ? { [Op.and]: and } : {}),
      },
      include: [
        {
          model: this.models.StudyRevision,
          as: 'revisions',
          required: true,
          where: { revision: { [Op.eq]: col('Study.currentRevision') } },
        },
      ],
      subQuery: false,
      order: [['updatedAt', 'DESC']],
      limit: filter.limit,
      offset: filter.offset,
    })) as (StudyRow & { revisions: StudyRevisionRow[] })[];
    return studies.map((study) => toDto(study, study.revisions[0] as StudyRevisionRow));
  }

  async get(teamId: string, id: string): Promise<StudyDto> {
    const study = await this.find(teamId, id);
    return toDto(study, await this.currentRevision(study));
  }

  async create(principal: Principal, projectId: string, content: StudyContent): Promise<StudyDto> {
    await this.projects.find(principal.teamId, projectId);
    return this.transaction(async (transaction) => {
      const study = await this.models.Study.create(
        {
          teamId: principal.teamId,
          projectId,
          currentRevision: 1,
          name: content.name,
          method: content.design.modulation.method,
        },
        { transaction },
      );
      const revision = await this.insertRevision(
        study.id,
        1,
        content,
        principal.user.id,
        null,
        transaction,
      );
      await this.audit.record(
        principal,
        'study.create',
        'study',
        study.id,
        { name: content.name, projectId },
        transaction,
      );
      return toDto(study, revision);
    });
  }

  async update(
    principal: Principal,
    id: string,
    baseRevision: number,
    content: StudyContent,
  ): Promise<StudyDto> {
    return this.saveRevision(principal, id, baseRevision, () =>
      Promise.resolve({ content, restoredFrom: null }),
    );
  }

  async restore(
    principal: Principal,
    id: string,
    revision: number,
    baseRevision: number,
  ): Promise<StudyDto> {
    return this.saveRevision(principal, id, baseRevision, async (study, transaction) => {
      const old = await this.models.StudyRevision.findOne({
        where: { studyId: study.id, revision },
        transaction,
      });
      if (!old) throw notFound(`Revision ${revision} of this study`);
      return { content: contentOf(old), restoredFrom: revision };
    });
  }

  async duplicate(principal: Principal, id: string, name?: string): Promise<StudyDto> {
    const study = await this.find(principal.teamId, id);
    const current = await this.currentRevision(study);
    const content = contentOf(current);
    return this.create(principal, study.projectId, {
      ...content,
      name: name ?? `${content.name} (copy)`.slice(0, 120),
    });
  }

  async revisions(teamId: string, id: string): Promise<StudyRevisionDto[]> {
    const study = await this.find(teamId, id);
    const rows = await this.models.StudyRevision.findAll({
      where: { studyId: study.id },
      order: [['revision', 'DESC']],
    });
    const authors = await this.models.User.findAll({
      where: { id: rows.map((r) => r.authorId).filter((v): v is string => !!v) },
    });
    const emails = new Map(authors.map((a) => [a.id, a.email]));
    return rows.map((row) => ({
      revision: row.revision,
      ...contentDto(row),
      authorEmail: row.authorId ? (emails.get(row.authorId) ?? null) : null,
      restoredFrom: row.restoredFrom,
      createdAt: iso(row.createdAt),
    }));
  }

  async find(teamId: string, id: string): Promise<StudyRow> {
    const study = await this.models.Study.findOne({ where: { id, teamId } });
    if (!study) throw notFound('That study');
    return study;
  }

  private async currentRevision(study: StudyRow): Promise<StudyRevisionRow> {
    const row = await this.models.StudyRevision.findOne({
      where: { studyId: study.id, revision: study.currentRevision },
    });
    if (!row) throw new Error(`study ${study.id} has no revision ${study.currentRevision}`);
    return row;
  }

  private async saveRevision(
    principal: Principal,
    id: string,
    baseRevision: number,
    makeContent: (
      study: StudyRow,
      t: Transaction,
    ) => Promise<{ content: StudyContent; restoredFrom: number | null }>,
  ): Promise<StudyDto> {
    const stale = (current: number) =>
      conflict(
        `This study changed since you loaded it: you edited revision ${baseRevision}, the latest is ${current}. ` +
          'Nothing was saved; reload the study, re-apply your change and save again.',
        [
          {
            path: 'baseRevision',
            message: `baseRevision must be the current revision ${current}; got ${baseRevision}`,
          },
        ],
      );
    try {
      return await this.transaction(async (transaction) => {
        const study = await this.models.Study.findOne({
          where: { id, teamId: principal.teamId },
          transaction,
        });
        if (!study) throw notFound('That study');
        if (study.currentRevision !== baseRevision) throw stale(study.currentRevision);
        const { content, restoredFrom } = await makeContent(study, transaction);
        const next = baseRevision + 1;
        // Conditional on the revision we read: a concurrent writer that got there first makes
        // this update match no row.
        const [changed] = await this.models.Study.update(
          { currentRevision: next, name: content.name, method: content.design.modulation.method },
          { where: { id, currentRevision: baseRevision }, transaction },
        );
        if (changed !== 1) throw stale(next);
        const revision = await this.insertRevision(
          id,
          next,
          content,
          principal.user.id,
          restoredFrom,
          transaction,
        );
        await this.audit.record(
          principal,
          restoredFrom ? 'study.restore' : 'study.update',
          'study',
          id,
          { revision: next, ...(restoredFrom ? { restoredFrom } : {}) },
          transaction,
        );
        await study.reload({ transaction });
        return toDto(study, revision);
      });
    } catch (error) {
      if (error instanceof UniqueConstraintError) {
        const study = await this.find(principal.teamId, id);
        throw stale(study.currentRevision);
      }
      throw error;
    }
  }

  private insertRevision(
    studyId: string,
    revision: number,
    content: StudyContent,
    authorId: string,
    restoredFrom: number | null,
    transaction: Transaction,
  ): Promise<StudyRevisionRow> {
    const { design } = content;
    return this.models.StudyRevision.create(
      {
        studyId,
        revision,
        name: content.name,
        method: design.modulation.method,
        design,
        ...legacyColumns(design),
        note: content.note ?? '',
        authorId,
        restoredFrom,
      },
      { transaction },
    );
  }
}

/**
 * The columns the previous release read (`parameters`, `load`, `filter`), still written for
 * each new revision so a database stays readable by it after a rollback: the full modulation
 * without its method (with vdc and mf or frequencyRatio), the load with the fundamental
 * frequency, and the filter. The service itself reads only `design`. A carrier that is no whole
 * multiple of the fundamental is written with its ratio p/q as mf (the previous release, which
 * took whole ratios only, refuses such a study's analysis with a 400 naming it).
 */
function legacyColumns(
  design: InverterDesign,
): Pick<StudyRevisionRow, 'parameters' | 'load' | 'filter'> {
  const span = designCarrierSpan(design);
  const { method: _method, ...parameters } =
    span === null ? designModulation(design) : designSpanModulation(design, span.p / span.q);
  const { load, filter } = design;
  return {
    parameters,
    load: load ? { ...load, frequency: design.fundamentalFrequency } : null,
    filter: filter ? { ...filter } : null,
  };
}

function contentOf(row: StudyRevisionRow): StudyContent {
  return contentDto(row);
}

function contentDto(
  row: StudyRevisionRow,
): Omit<StudyRevisionDto, 'revision' | 'authorEmail' | 'restoredFrom' | 'createdAt'> {
  if (!row.design)
    throw new Error(`study revision ${row.id} has no design (migration 0002 not applied?)`);
  return { name: row.name, design: row.design, note: row.note };
}

function toDto(study: StudyRow, revision: StudyRevisionRow): StudyDto {
  return {
    id: study.id,
    projectId: study.projectId,
    revision: revision.revision,
    method: revision.method,
    ...contentDto(revision),
    createdAt: iso(study.createdAt),
    updatedAt: iso(study.updatedAt),
  };
}
