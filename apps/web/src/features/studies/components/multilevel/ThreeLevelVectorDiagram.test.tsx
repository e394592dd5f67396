import { analyseDesign, type InverterDesign } from '@pulsewright/modulation';
import { fireEvent, render, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { ThreeLevelVectorDiagram } from './ThreeLevelVectorDiagram';

const design: InverterDesign = {
  vdc: 800,
  fundamentalFrequency: 50,
  carrierFrequency: 1200,
  modulation: { method: 'multilevel-space-vector', m: 0.8, topology: 'npc' },
  load: { r: 10, l: 0.01 },
};

describe('ThreeLevelVectorDiagram', () => {
  it('draws the report’s 19 points and marks the states the report applies in the period chosen', () => {
    const data = analyseDesign(design).multilevel?.vectorDiagram;
    if (!data) throw new Error('a three-level space-vector design has a diagram');
    render(<ThreeLevelVectorDiagram data={data} fileStem="sv" />);
    const figure = screen.getByRole('figure', { name: 'Three-level vector diagram' });
    // 27 states on 19 points (Celanovic and Boroyevich 2000).
    expect(figure.querySelectorAll('[data-kind]')).toHaveLength(19);
    fireEvent.change(within(figure).getByLabelText('Switching period shown'), {
      target: { value: '5' },
    });
    const sample = data.trajectory.find((s) => s.period === 5);
    if (!sample) throw new Error('expected period 5');
    // Nearest three vectors: the lit points are exactly those holding the applied states.
    const lit = [...figure.querySelectorAll('[data-applied]')].flatMap((g) =>
      (g.querySelector('text')?.textContent ?? '').split('/'),
    );
    for (const state of sample.states) expect(lit).toContain(state);
    expect(figure.querySelectorAll('[data-applied]')).toHaveLength(3);
    expect(screen.getByTestId('vector-period')).toHaveTextContent(
      `sector ${sample.sector}, region ${sample.region}`,
    );
  });
});
