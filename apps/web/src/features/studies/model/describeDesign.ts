import {
  describeGridConnection,
  designCarrierSpan,
  designFrequencyRatio,
  type GridFigures,
  MODULATION_METHOD_LABELS,
  modulationPhaseCount,
  type InverterDesign,
} from '@pulsewright/modulation';
import { formatNumber } from '../../../lib/format';
import {
  CLAMPING_OPTIONS,
  DAMPING_OPTIONS,
  labelOf,
  MULTILEVEL_CARRIER_OPTIONS,
  MULTILEVEL_TOPOLOGY_OPTIONS,
  MULTILEVEL_ZERO_SEQUENCE_OPTIONS,
  OVERMODULATION_OPTIONS,
  PATTERN_KIND_OPTIONS,
  SAMPLING_OPTIONS,
  SCHEME_OPTIONS,
  SEQUENCE_OPTIONS,
  SPACE_VECTOR_SAMPLING_OPTIONS,
  ZERO_SEQUENCE_OPTIONS,
} from '../../../lib/modulationOptions';
import { designOf, draftOf } from './studyDraft';

const degrees = (radians: number) => `${formatNumber((radians * 180) / Math.PI, 6)}°`;

/**
 * The frequency ratio a carrier design states (carrier ÷ fundamental), for display: a whole mf,
 * or for a ratio that is not whole its nearest p/q and the span the report covers (sine-triangle,
 * three-phase carrier, space vector; designCarrierSpan).
 */
function ratioText(design: InverterDesign): string {
  if (design.carrierFrequency === undefined) return '';
  try {
    return `mf ${designFrequencyRatio(design)}`;
  } catch {
    try {
      const span = designCarrierSpan(design);
      if (span !== null)
        return `mf ${span.p}/${span.q} ≈ ${formatNumber(span.p / span.q, 6)}, analysed over ${span.q} fundamental periods`;
    } catch {
      // Out of range: said on the field.
    }
    return 'mf not a whole number';
  }
}

/**
 * The whole design as label–value rows with units, as the printed report lists it (defaults
 * written out). A grid-tied design lists its grid, impedance and LCL filter in the library's words
 * (`describeGridConnection`) instead of a load; with the report's grid figures, also the
 * short-circuit figures, the LCL resonance, each standard's verdict on the grid current and the
 * caution that the limits are recalled from memory.
 */
export function designRows(
  stored: InverterDesign,
  gridFigures: GridFigures | null = null,
): [string, string][] {
  // Read through the editor's state so the options a stored design leaves out print as their defaults.
  const design = designOf(draftOf(stored, { name: '', projectId: '' }));
  const m = design.modulation;
  const rows: [string, string][] = [['Method', MODULATION_METHOD_LABELS[m.method]]];
  switch (m.method) {
    case 'sine-triangle':
      rows.push(
        ['Bridge scheme', labelOf(SCHEME_OPTIONS, m.scheme)],
        ['Sampling', labelOf(SAMPLING_OPTIONS, m.sampling ?? 'natural')],
      );
      break;
    case 'three-phase':
      rows.push(
        ['Zero sequence', labelOf(ZERO_SEQUENCE_OPTIONS, m.zeroSequence ?? 'none')],
        ['Sampling', labelOf(SAMPLING_OPTIONS, m.sampling ?? 'natural')],
      );
      break;
    case 'space-vector':
      rows.push(['Switching sequence', labelOf(SEQUENCE_OPTIONS, m.sequence ?? 'seven-segment')]);
      if (m.sequence === 'five-segment')
        rows.push(['Zero-vector clamping', labelOf(CLAMPING_OPTIONS, m.clamping ?? 'dpwm1')]);
      else rows.push(['Zero split', formatNumber(m.zeroSplit ?? 0.5)]);
      rows.push(
        ['Sampling', labelOf(SPACE_VECTOR_SAMPLING_OPTIONS, m.sampling ?? 'symmetric')],
        ['Overmodulation', labelOf(OVERMODULATION_OPTIONS, m.overmodulation ?? 'two-mode')],
      );
      break;
    case 'selective-harmonic-elimination':
    case 'optimal-pattern':
      rows.push(
        ['Pattern', labelOf(PATTERN_KIND_OPTIONS, m.kind)],
        ['First-quarter angles', m.angles.map(degrees).join(', ')],
      );
      if (m.method === 'selective-harmonic-elimination')
        rows.push(['Eliminated orders', m.eliminate?.join(', ') || '—']);
      if (m.fundamental !== undefined)
        rows.push(['Solved for', `${formatNumber(m.fundamental)} V peak`]);
      break;
    case 'multilevel-carrier':
      rows.push(
        ['Topology', labelOf(MULTILEVEL_TOPOLOGY_OPTIONS, m.topology)],
        ['Levels', String(m.levels)],
        ['Carriers', labelOf(MULTILEVEL_CARRIER_OPTIONS, m.carriers)],
        ['Phases', String(m.phaseCount)],
        ['Zero sequence', labelOf(MULTILEVEL_ZERO_SEQUENCE_OPTIONS, m.zeroSequence ?? 'none')],
        ['Sampling', labelOf(SAMPLING_OPTIONS, m.sampling ?? 'natural')],
      );
      break;
    case 'multilevel-space-vector':
      rows.push(
        ['Topology', labelOf(MULTILEVEL_TOPOLOGY_OPTIONS, m.topology ?? 'npc')],
        ['Small-vector split', formatNumber(m.smallVectorSplit ?? 0.5)],
        ['Sampling', labelOf(SPACE_VECTOR_SAMPLING_OPTIONS, m.sampling ?? 'symmetric')],
      );
      break;
  }
  rows.push(['DC bus', `${formatNumber(design.vdc)} V`]);
  if ('ma' in m && m.ma !== undefined) rows.push(['Modulation index ma', formatNumber(m.ma, 6)]);
  rows.push(['Fundamental frequency', `${formatNumber(design.fundamentalFrequency, 6)} Hz`]);
  if (design.carrierFrequency !== undefined)
    rows.push([
      'Carrier frequency',
      `${formatNumber(design.carrierFrequency, 6)} Hz (${ratioText(design)})`,
    ]);
  if ('carrierPhase' in m && m.carrierPhase) rows.push(['Carrier phase', degrees(m.carrierPhase)]);
  const three = modulationPhaseCount(m) === 3;
  const { load, filter } = design;
  const grid = describeGridConnection(design, gridFigures);
  if (grid) {
    rows.push(...grid.rows);
    if (filter) rows.push(['Filter damping', dampingText(filter)]);
    rows.push(...grid.verdicts.map((verdict): [string, string] => ['Grid current', verdict]));
    if (grid.caution) rows.push(['Grid limits', grid.caution]);
  } else if (load) {
    rows.push([
      three ? 'Load per phase (star)' : 'Load',
      `R ${formatNumber(load.r)} Ω, L ${formatNumber(load.l * 1e3)} mH`,
    ]);
    if (load.emf)
      rows.push([
        'Back-EMF',
        `${formatNumber(load.emf.amplitude)} V peak at ${degrees(load.emf.phase)}`,
      ]);
  } else rows.push(['Load', 'none']);
  // A grid design's filter is in the grid's rows (L1 and C with L2, an LCL).
  if (!grid && filter)
    rows.push(
      [
        three ? 'LC filter per phase (star)' : 'LC filter',
        `L ${formatNumber(filter.l * 1e3)} mH, C ${formatNumber(filter.c * 1e6)} µF`,
      ],
      ['Filter damping', dampingText(filter)],
    );
  else if (!grid) rows.push(['LC filter', 'none']);
  if (design.device) rows.push(['Switching device', deviceText(design.device)]);
  return rows;
}

/** The filter's damping resistor, where it sits and its capacitor when it has one. */
function dampingText(filter: NonNullable<InverterDesign['filter']>): string {
  return `${formatNumber(filter.rDamping ?? 0)} Ω, ${labelOf(DAMPING_OPTIONS, filter.dampingPlacement ?? 'series-with-capacitor')}${filter.cDamping !== undefined ? `, ${formatNumber(filter.cDamping * 1e6)} µF` : ''}`;
}

/** A switching device's datasheet values as the loss model takes them (V, mΩ, mJ at the test point). */
function deviceText(device: NonNullable<InverterDesign['device']>): string {
  const energies = `Eon ${formatNumber(device.eon * 1e3)} mJ, Eoff ${formatNumber(device.eoff * 1e3)} mJ, Err ${formatNumber(device.err * 1e3)} mJ at ${formatNumber(device.referenceVoltage)} V, ${formatNumber(device.referenceCurrent)} A`;
  return device.kind === 'igbt'
    ? `IGBT with diode: Vce0 ${formatNumber(device.vce0)} V, rce ${formatNumber(device.rce * 1e3)} mΩ, Vf0 ${formatNumber(device.vf0)} V, rf ${formatNumber(device.rf * 1e3)} mΩ; ${energies}`
    : `MOSFET: RDS(on) ${formatNumber(device.rdsOn * 1e3)} mΩ; ${energies}`;
}

/** One line about a design for lists: method's options, index, DC bus, carrier, load and filter. */
export function describeDesign(design: InverterDesign): string {
  const m = design.modulation;
  const parts: string[] = [];
  if (m.method === 'selective-harmonic-elimination' || m.method === 'optimal-pattern') {
    parts.push(`${m.kind}`, `${m.angles.length} angle(s)`);
    if (m.method === 'selective-harmonic-elimination' && m.eliminate?.length)
      parts.push(`eliminates ${m.eliminate.join(', ')}`);
  } else {
    const index =
      m.ma !== undefined
        ? `ma ${formatNumber(m.ma)}`
        : 'm' in m && m.m !== undefined
          ? `m ${formatNumber(m.m)}`
          : '';
    const option =
      m.method === 'sine-triangle'
        ? m.scheme
        : m.method === 'three-phase'
          ? m.zeroSequence
          : m.method === 'multilevel-carrier'
            ? `${m.topology} ${m.levels}-level ${m.carriers}`
            : m.method === 'multilevel-space-vector'
              ? `three-level ${m.topology ?? 'npc'}`
              : m.sequence;
    parts.push(
      ...[
        index,
        ratioText(design),
        design.carrierFrequency !== undefined
          ? `${formatNumber(design.carrierFrequency)} Hz carrier`
          : '',
        option ?? '',
      ].filter(Boolean),
    );
  }
  parts.push(`${formatNumber(design.vdc)} V`, `${formatNumber(design.fundamentalFrequency)} Hz`);
  if (design.load) parts.push('load');
  if (design.filter) parts.push('LC filter');
  return parts.join(' · ');
}
