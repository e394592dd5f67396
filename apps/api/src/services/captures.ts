import {
  compareCapture,
  defaultSpectrumOrder,
  MAX_CAPTURE_ORDER,
  type FftWindowName,
} from '@pulsewright/modulation';
import type { CaptureRow, Models } from '../models/index.js';
import { badRequest, notFound } from '../http/errors.js';
import type { AuditLog } from './audit.js';
import { sanitiseFileName } from './captureCsv.js';
import type { ComputeService } from './computeService.js';
import { iso } from './dto.js';
import type { Principal } from './principal.js';
import type { ProjectService } from './projects.js';
import type { StudyService } from './studies.js';

export interface CaptureDto {
  id: string;
  projectId: string | null;
  name: string;
  fileName: string;
  rows: number;
  sampleRate: number;
  duration: number;
  columns: string[];
  byteSize: number;
  createdAt: string;
}

export interface AnalysisOptions {
  window: FftWindowName;
  fundamentalFrequency?: number;
  maxOrder: number;
  column: 'voltage' | 'current';
}

/** A comparison's options: without `maxOrder`, up to the study's third carrier group. */
export type ComparisonOptions = Omit<AnalysisOptions, 'maxOrder' | 'column'> & {
  maxOrder?: number;
};

/** Bench captures: checked and parsed on upload (the original kept), analysed by fftSpectrum. */
export class CaptureService {
  constructor(
    private readonly models: Models,
    private readonly audit: AuditLog,
    private readonly projects: ProjectService,
    private readonly studies: StudyService,
    private readonly compute: ComputeService,
  ) {}

  async upload(
    principal: Principal,
    file: { buffer: Buffer; originalname?: string; mimetype?: string },
    fields: { name?: string; projectId?: string },
  ): Promise<CaptureDto> {
    // Everything is checked before anything is written: a rejected file stores nothing.
    if (fields.projectId) await this.projects.find(principal.teamId, fields.projectId);
    const parsed = await this.compute.parseCapture(file.buffer);
    const fileName = sanitiseFileName(file.originalname);
    const row = await this.models.Capture.create({
      teamId: principal.teamId,
      projectId: fields.projectId ?? null,
      name: fields.name?.trim() || fileName.replace(/\.[^.]*$/, '') || 'capture',
      fileName,
      contentType: 'text/csv',
      byteSize: file.buffer.length,
      original: file.buffer,
      series: parsed.series,
      rows: parsed.rows,
      sampleRate: parsed.sampleRate,
      duration: parsed.duration,
      columns: parsed.columns,
      uploadedById: principal.user.id,
    });
    await this.audit.record(principal, 'capture.upload', 'capture', row.id, {
      fileName,
      rows: parsed.rows,
    });
    return toDto(row);
  }

  async list(teamId: string, projectId?: string): Promise<CaptureDto[]> {
    const rows = await this.models.Capture.findAll({
      where: { teamId, ...(projectId ? { projectId } : {}) },
      attributes: { exclude: ['original', 'series'] },
      order: [['createdAt', 'DESC']],
    });
    return rows.map(toDto);
  }

  async find(teamId: string, id: string): Promise<CaptureRow> {
    const row = await this.models.Capture.findOne({ where: { id, teamId } });
    if (!row) throw notFound('That capture');
    return row;
  }

  async get(teamId: string, id: string): Promise<CaptureDto & { series: CaptureRow['series'] }> {
    const row = await this.find(teamId, id);
    return { ...toDto(row), series: row.series };
  }

  async analyse(teamId: string, id: string, options: AnalysisOptions) {
    const row = await this.find(teamId, id);
    const samples = options.column === 'current' ? row.series.current : row.series.voltage;
    if (!samples) {
      const message = 'column must be voltage: this capture has no current column';
      throw badRequest(message, [{ path: 'column', message }]);
    }
    const spectrum = await this.compute.captureSpectrum(samples, row.sampleRate, {
      window: options.window,
      maxOrder: options.maxOrder,
      ...(options.fundamentalFrequency
        ? { fundamentalFrequency: options.fundamentalFrequency }
        : {}),
    });
    return { captureId: row.id, column: options.column, ...spectrum };
  }

  /**
   * Measured harmonics of a capture against the exact prediction of a study, order by order: the
   * study's bridge voltage as GET /studies/{id}/spectrum gives it (line a−b for three-phase), by
   * default up to the study's third carrier group and its sidebands (the library's
   * defaultSpectrumOrder, 3·mf + 20), with the library's warnings (fundamentals more than 1 %
   * apart, orders past the capture's Nyquist frequency, a study's sub- and inter-harmonics that
   * whole orders cannot compare) and no ratio below its noise floor.
   */
  async compare(teamId: string, id: string, studyId: string, options: ComparisonOptions) {
    const study = await this.studies.get(teamId, studyId);
    const maxOrder =
      options.maxOrder ?? Math.min(MAX_CAPTURE_ORDER, defaultSpectrumOrder(study.design));
    const measured = await this.analyse(teamId, id, { ...options, maxOrder, column: 'voltage' });
    const predicted = await this.compute.designSpectrum(study.design, maxOrder, 'study.design');
    // A study whose carrier spans q periods predicts every n/q: the capture's whole orders are
    // compared with those at whole orders, and the rest are summed and named in a warning.
    const figures = compareCapture(measured.harmonics, predicted.harmonics, {
      measuredFrequency: measured.fundamentalFrequency,
      predictedFrequency: study.design.fundamentalFrequency,
      maxOrder,
      fundamentalPeriods: predicted.carrierSpan?.q ?? 1,
    });
    return {
      captureId: id,
      studyId,
      studyRevision: study.revision,
      window: measured.window,
      periodic: measured.periodic,
      periods: measured.periods,
      fundamentalFrequency: measured.fundamentalFrequency,
      studyFundamentalFrequency: study.design.fundamentalFrequency,
      maxOrder,
      measuredThd: measured.thd,
      ...figures,
    };
  }
}

function toDto(row: CaptureRow): CaptureDto {
  return {
    id: row.id,
    projectId: row.projectId,
    name: row.name,
    fileName: row.fileName,
    rows: row.rows,
    sampleRate: row.sampleRate,
    duration: row.duration,
    columns: row.columns,
    byteSize: row.byteSize,
    createdAt: iso(row.createdAt),
  };
}
