import {
  describeGridConnection,
  designResonance,
  type DesignReport,
  type InverterDesign,
} from '@pulsewright/modulation';
import type { Models } from '../models/index.js';
import type { ComputeService } from './computeService.js';
import type { AuditLog } from './audit.js';
import type { Mailer } from './mail.js';
import type { Principal } from './principal.js';
import type { StudyService } from './studies.js';

/** The hazard caution every shared report carries (docs/references.md, "Cautions"). */
export const REPORT_CAUTION =
  'Inverter DC buses and outputs are lethal. Predictions here are idealised (ideal switches unless a loss or ' +
  'dead-time model is chosen) and are no substitute for measurement, protective design, and the codes and ' +
  'licensed practice that apply where the equipment is built and installed.';

export interface ShareInput {
  email: string;
  message?: string | undefined;
}

export interface StudyShareDto {
  sent: true;
  to: string;
  revision: number;
  link: string;
}

/** Control characters (other than tab and newline) never reach a mail body or subject. */
const stripControls = (text: string, keepNewlines: boolean): string =>
  text.replace(
    // eslint-disable-next-line no-control-regex
    keepNewlines ? /[\u0000-\u0008\u000b-\u001f\u007f]/g : /[\u0000-\u001f\u007f]/g,
    keepNewlines ? '' : ' ',
  );

/** E-mails a link to a study's printable report through the mail path, and audits it. */
export class StudyShareService {
  constructor(
    private readonly models: Models,
    private readonly audit: AuditLog,
    private readonly mailer: Mailer,
    private readonly studies: StudyService,
    private readonly compute: ComputeService,
    private readonly publicUrl: string,
  ) {}

  async share(principal: Principal, studyId: string, input: ShareInput): Promise<StudyShareDto> {
    const study = await this.studies.find(principal.teamId, studyId);
    const revision = await this.models.StudyRevision.findOne({
      where: { studyId: study.id, revision: study.currentRevision },
    });
    const report = revision?.design
      ? await this.compute.report(revision.design, {}, 'study.design', [])
      : null;
    const author = revision?.authorId ? await this.models.User.findByPk(revision.authorId) : null;
    const to = input.email.toLowerCase();
    const link = `${this.publicUrl}/studies/${study.id}/report`;
    const name = stripControls(study.name, false);
    const by = author ? `${author.name} <${author.email}>` : 'an unknown author';
    const message = input.message ? stripControls(input.message, true).trim() : '';
    const text =
      `${principal.user.name} (${principal.user.email}) shared a Pulsewright study report with you.\n\n` +
      `Study: ${name}\nRevision: ${study.currentRevision}, saved by ${by}\nReport: ${link}\n\n` +
      (report && revision?.design ? `${reportFigures(report, revision.design)}\n\n` : '') +
      (message ? `Message from ${principal.user.name}:\n${message}\n\n` : '') +
      `Caution. ${REPORT_CAUTION}\n`;
    await this.mailer.send({
      to,
      subject: `Pulsewright study report: ${name}`,
      text,
      teamId: principal.teamId,
    });
    await this.audit.record(principal, 'study.share', 'study', study.id, {
      to,
      revision: study.currentRevision,
      withMessage: message !== '',
    });
    return { sent: true, to, revision: study.currentRevision, link };
  }
}

const percent = (ratio: number): string => `${(100 * ratio).toFixed(2)} %`;
const fixed = (value: number, unit: string): string => `${Number(value.toPrecision(4))} ${unit}`;

/** A non-integer ratio as the report states it: p/q, the carrier analysed and its error, the span. */
const spanRatio = (span: NonNullable<DesignReport['carrierSpan']>): string =>
  `${span.p}/${span.q} (carrier analysed ${fixed(span.carrierFrequency, 'Hz')}, ${fixed(span.carrierError, 'Hz')} from the one asked for; every figure over ${span.q} fundamental periods, THD with the sub-harmonics)`;

/**
 * The headline figures of the design report, as plain text lines (every figure from the report);
 * a grid-tied design's grid, LCL and grid-current verdicts with their caution in the library's
 * words (`describeGridConnection`), as the printed report and the command line give them.
 */
export function reportFigures(report: DesignReport, design: InverterDesign): string {
  const lines = [
    `Key figures (revision's design report): ${report.methodLabel}${report.frequencyRatio === null ? '' : `, mf ${report.carrierSpan ? spanRatio(report.carrierSpan) : report.frequencyRatio}`}`,
  ];
  const { bridge, lineToLine, output, limitCheck } = report;
  lines.push(
    `- ${bridge.name}: fundamental ${fixed(bridge.fundamental, 'V peak')}, THD ${percent(bridge.thd)}, WTHD ${percent(bridge.wthd)} (exact, whole waveform)`,
  );
  if (lineToLine)
    lines.push(
      `- ${lineToLine.name}: fundamental ${fixed(lineToLine.fundamental, 'V peak')}, THD ${percent(lineToLine.thd)}`,
    );
  if (output)
    lines.push(
      `- ${output.name}: fundamental ${fixed(output.fundamental, 'V peak')}, THD ${percent(output.thd)} (to order ${report.analysisOrder}; at most ${percent(output.thdUpperBound)} over the whole waveform)`,
    );
  const phase = report.currents[0];
  if (phase) {
    lines.push(
      `- ${phase.inverter.name}: ${fixed(phase.inverter.rms, 'A rms')}, ripple ${fixed(phase.inverter.ripplePeakToPeak, 'A peak-to-peak')}`,
    );
    if (phase.load) lines.push(`- ${phase.load.name}: ${fixed(phase.load.rms, 'A rms')}`);
  }
  // With a grid the report's load is the grid's series resistance r, and the resonance is the
  // LCL's, not L1 with C's (the library's designResonance names it).
  if (report.loadPower !== null)
    lines.push(
      `- power into the ${report.grid ? "grid's series resistance" : 'load resistance'}: ${fixed(report.loadPower, 'W')}`,
    );
  const resonance = designResonance(report);
  if (resonance)
    lines.push(
      `- ${resonance.name === 'LC filter resonance' ? 'filter resonance' : resonance.name}: ${fixed(resonance.frequency, 'Hz')}` +
        (resonance.distances === null ? '' : ` (${resonance.distances})`),
    );
  const grid = describeGridConnection(design, report.grid);
  if (grid) {
    lines.push(...grid.rows.map(([label, value]) => `- ${label}: ${value}`));
    lines.push(...grid.verdicts.map((verdict) => `- grid current, ${verdict}`));
  }
  lines.push(
    `- ${limitCheck.standard.name}-${limitCheck.standard.edition} voltage limits (recalled from memory): ${limitCheck.pass ? 'pass' : 'fail'}` +
      ` (THD ${percent(limitCheck.thdWholeWaveform)} whole waveform, limit ${percent(limitCheck.limits.thd)})`,
  );
  if (grid?.caution) lines.push(`Grid caution. ${grid.caution}`);
  return lines.join('\n');
}
