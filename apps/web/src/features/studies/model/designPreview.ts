import {
  analyseDesign,
  type AnalyseDesignOptions,
  type DesignReport,
  type InverterDesign,
} from '@pulsewright/modulation';

/** A field the library refused, by its path in the design (`modulation.ma`, `load.r`, …), with its message. */
export interface PreviewFieldError {
  field: string;
  message: string;
}

/** The design report (null when the design itself was refused) and the fields the library refused. */
export interface PreviewOutcome {
  report: DesignReport | null;
  errors: PreviewFieldError[];
}

function asFieldError(error: unknown): PreviewFieldError {
  const field = (error as { field?: unknown }).field;
  return {
    field: typeof field === 'string' ? field : 'design',
    message: error instanceof Error ? error.message : String(error),
  };
}

/**
 * The editor's live preview: the library's {@link analyseDesign} of the draft's design, exactly
 * what the service returns for the same design (a test holds the two to 1e-12). When only the
 * load or the filter is refused, the report of the design without that part comes back beside
 * the error, so the voltages stay on screen while the field is being corrected.
 */
export function previewDesign(
  design: InverterDesign,
  options: AnalyseDesignOptions = {},
): PreviewOutcome {
  const errors: PreviewFieldError[] = [];
  let attempt = design;
  let settings = options;
  // At most four tries: as given, then without each refused part (load, filter, bus voltage) in turn.
  for (let tries = 0; tries < 4; tries++) {
    try {
      return { report: analyseDesign(attempt, settings), errors };
    } catch (error) {
      const refused = asFieldError(error);
      errors.push(refused);
      if (refused.field.startsWith('load') && attempt.load) attempt = { ...attempt, load: null };
      else if (refused.field.startsWith('filter') && attempt.filter)
        attempt = { ...attempt, filter: null };
      else if (refused.field === 'busVoltage' && settings.busVoltage !== undefined)
        settings = withoutBusVoltage(settings);
      else break;
    }
  }
  return { report: null, errors };
}

function withoutBusVoltage({
  busVoltage: _busVoltage,
  ...rest
}: AnalyseDesignOptions): AnalyseDesignOptions {
  return rest;
}
