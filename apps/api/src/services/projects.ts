import { fn, col, Op, type Sequelize } from 'sequelize';
import type { Models, ProjectRow } from '../models/index.js';
import { badRequest, notFound } from '../http/errors.js';
import type { AuditLog } from './audit.js';
import { iso } from './dto.js';
import type { Principal } from './principal.js';

export interface ProjectDto {
  id: string;
  name: string;
  description: string;
  studyCount: number;
  createdAt: string;
  updatedAt: string;
}

/**
 * Escapes LIKE wildcards so a search for `50%` means the text `50%`. Control characters
 * (U+0000–U+001F, U+007F) are refused with a 400 naming `q`: no name can hold them, and SQLite
 * ends the inlined literal at NUL (defect F3 in docs/robustness.md).
 */
export function likePattern(text: string): string {
  // eslint-disable-next-line no-control-regex
  const control = /[\u0000-\u001f\u007f]/u.exec(text);
  if (control) {
    const code = `U+${(control[0].codePointAt(0) ?? 0).toString(16).toUpperCase().padStart(4, '0')}`;
    const message = `q must be plain text without control characters; got ${code} at position ${control.index + 1}`;
    throw badRequest(message, [{ path: 'q', message }]);
  }
  return `%${text.toLowerCase().replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

/**
 * `lower(column) LIKE '%text%' ESCAPE '\'`: case-insensitive substring match in which `%`, `_`
 * and `\` of the text are literal (SQLite has no default LIKE escape character, so the clause
 * must name it; PostgreSQL accepts the same clause).
 */
export function containsText(
  sequelize: Sequelize,
  column: string,
  text: string,
): ReturnType<Sequelize['where']> {
  const pattern = sequelize.literal(`${sequelize.escape(likePattern(text))} ESCAPE '\\'`);
  return sequelize.where(fn('lower', col(column)), Op.like, pattern);
}

export class ProjectService {
  constructor(
    private readonly models: Models,
    private readonly audit: AuditLog,
  ) {}

  async list(teamId: string, q?: string): Promise<ProjectDto[]> {
    const where = q
      ? { teamId, [Op.and]: [containsText(this.models.sequelize, 'name', q)] }
      : { teamId };
    const rows = await this.models.Project.findAll({ where, order: [['name', 'ASC']] });
    return Promise.all(rows.map((row) => this.toDto(row)));
  }

  async get(teamId: string, id: string): Promise<ProjectDto> {
    return this.toDto(await this.find(teamId, id));
  }

  async find(teamId: string, id: string): Promise<ProjectRow> {
    const row = await this.models.Project.findOne({ where: { id, teamId } });
    if (!row) throw notFound('That project');
    return row;
  }

  async create(
    principal: Principal,
    input: { name: string; description?: string },
  ): Promise<ProjectDto> {
    const row = await this.models.Project.create({
      teamId: principal.teamId,
      name: input.name,
      description: input.description ?? '',
      createdById: principal.user.id,
    });
    await this.audit.record(principal, 'project.create', 'project', row.id, { name: row.name });
    return this.toDto(row);
  }

  async update(
    principal: Principal,
    id: string,
    input: { name?: string; description?: string },
  ): Promise<ProjectDto> {
    const row = await this.find(principal.teamId, id);
    await row.update(input);
    await this.audit.record(principal, 'project.update', 'project', row.id, { ...input });
    return this.toDto(row);
  }

  private async toDto(row: ProjectRow): Promise<ProjectDto> {
    const studyCount = await this.models.Study.count({ where: { projectId: row.id } });
    return {
      id: row.id,
      name: row.name,
      description: row.description,
      studyCount,
      createdAt: iso(row.createdAt),
      updatedAt: iso(row.updatedAt),
    };
  }
}
