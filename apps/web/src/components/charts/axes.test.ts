import { describe, expect, it } from 'vitest';
import { angleAxis, formatRadians, leftAxisLabelOffset, logLabelled } from './axes';

// Issue 10: angle axes read in clean fractions of π (0, π/2, π…) or in degrees, never 0.33π.
describe('angle axis', () => {
  it('puts a full period at 0, π/2, π, 3π/2, 2π', () => {
    const { ticks, format } = angleAxis(0, 2 * Math.PI);
    expect(ticks.map(format)).toEqual(['0', 'π/2', 'π', '3π/2', '2π']);
  });

  it('uses π/6 or π/12 steps on a zoomed window and degrees below 60°', () => {
    // 0 to π/2: π/12 steps give six intervals (π/4 steps give only two).
    const quarter = angleAxis(0, Math.PI / 2);
    expect(quarter.ticks.map(quarter.format)).toEqual([
      '0',
      'π/12',
      'π/6',
      'π/4',
      'π/3',
      '5π/12',
      'π/2',
    ]);
    // 10° to 30°: round degrees.
    const window = angleAxis((10 * Math.PI) / 180, (30 * Math.PI) / 180);
    expect(window.ticks.map(window.format)).toEqual(['10°', '15°', '20°', '25°', '30°']);
  });

  it('writes negative and non-multiple angles cleanly', () => {
    expect(formatRadians(-Math.PI / 2)).toBe('−π/2');
    expect(formatRadians((2 * Math.PI) / 3)).toBe('2π/3');
    expect(formatRadians((12.5 * Math.PI) / 180)).toBe('12.5°');
  });
});

describe('left axis label', () => {
  it('clears the widest tick text (issue 10: "3000 %" overlapped the label)', () => {
    // 8 px tick, ~6.2 px a character at font size 10, a gap: the label moves out with the text.
    expect(leftAxisLabelOffset(['0 %', '3000 %'])).toBeGreaterThan(8 + 6 * 6 + 6);
    expect(leftAxisLabelOffset(['0', '1'])).toBe(44);
  });
});

describe('log axis labels', () => {
  it('labels only the decades over a long span, and 1, 2, 5 over a short one', () => {
    // d3's log ticks: 1..9 of each decade. 0.01 to 100 (1 % to 10,000 %): four decades.
    const long = [0.01, 0.02, 0.05, 0.1, 0.3, 1, 2, 10, 20, 50, 100];
    expect(long.filter(logLabelled(long))).toEqual([0.01, 0.1, 1, 10, 100]);
    const short = [1, 2, 3, 4, 5, 10, 20, 30];
    expect(short.filter(logLabelled(short))).toEqual([1, 2, 5, 10, 20]);
  });
});
