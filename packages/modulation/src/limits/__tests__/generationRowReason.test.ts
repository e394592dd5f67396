import { describe, expect, it } from 'vitest';
import { generationRowReason } from '../generationRowReason.js';

// IEEE Std 519-2022 Table 2's footnote (recalled from memory): all power generation equipment is
// held to the first row, I_SC/I_L < 20, whatever the actual I_SC/I_L.
const firstRow = { label: 'I_SC/I_L < 20', byGenerationRule: true };

describe('generationRowReason', () => {
  it('says why the < 20 row is used when the generation footnote chose it over a higher ratio', () => {
    const reason = generationRowReason(firstRow, 80.46);
    expect(reason).toContain('The I_SC/I_L < 20 row is used although I_SC/I_L is 80.46');
    expect(reason).toContain('generating equipment whatever the actual ratio');
    expect(reason).toContain('from memory: confirm with the standard and the utility');
  });

  it('says nothing when the ratio itself picks the first row (below 20) or the footnote did not apply', () => {
    expect(generationRowReason(firstRow, 19.9)).toBeNull();
    expect(
      generationRowReason({ label: '50 < I_SC/I_L < 100', byGenerationRule: false }, 80),
    ).toBeNull();
  });

  it('speaks at exactly 20, where the ratio alone would pick the second row', () => {
    expect(generationRowReason(firstRow, 20)).toContain('although I_SC/I_L is 20');
  });
});
