import { firmwareEffects, timerTable } from '@pulsewright/modulation';
import { render, screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { formatNumber, formatPercent } from '../../../lib/format';
import { OutputEffectPanels } from './OutputEffectPanels';

const table = timerTable({
  modulation: { method: 'sine-triangle', scheme: 'unipolar', ma: 0.9 },
  fundamentalFrequency: 50,
  carrierFrequency: 5000,
  timerClock: 16e6,
  deadTime: 1e-6,
  vdc: 360,
});

describe('OutputEffectPanels', () => {
  it('shows the on-state drops’ own effect as the library gives it, and names them in the total', () => {
    const effects = firmwareEffects(table, { onStateDrop: { transistor: 1.2, diode: 1.6 } });
    const drop = effects.onStateDrop!;
    render(<OutputEffectPanels table={table} effects={effects} stem="t" />);
    const line = screen.getByTestId('on-state-drop-effect');
    expect(line).toHaveTextContent(formatNumber(drop.referenceFundamental));
    expect(line).toHaveTextContent(formatNumber(drop.realisedFundamental));
    expect(line).toHaveTextContent(formatPercent(drop.realisedThd));
    // Drops against the current lower the fundamental (current in phase with the voltage).
    expect(drop.realisedFundamental).toBeLessThan(drop.referenceFundamental);
    expect(screen.getByText(/dead time and on-state drops together/)).toBeInTheDocument();
  });

  it('says nothing of drops for ideal switches', () => {
    render(<OutputEffectPanels table={table} effects={firmwareEffects(table)} stem="t" />);
    expect(screen.queryByTestId('on-state-drop-effect')).toBeNull();
    expect(screen.getByText(/minimum pulse, dead time together/)).toBeInTheDocument();
  });
});
