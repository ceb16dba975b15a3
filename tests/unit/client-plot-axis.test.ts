import { describe, expect, it } from 'vitest';
import { formatFrequencyTick, formatPowerOfTen, linearTicks, logTicks } from '../../src/components/plots/log-axis';

describe('logTicks', () => {
  it('logTicks([1, 1e6]) puts a labelled major tick on every decade and 2…9 minors between', () => {
    const ticks = logTicks([1, 1e6], 10, formatFrequencyTick);
    const majors = ticks.filter((t) => t.major);
    expect(majors.map((t) => t.value)).toEqual([1, 10, 100, 1e3, 1e4, 1e5, 1e6]);
    expect(majors.map((t) => t.label)).toEqual(['1\u00a0Hz', '10\u00a0Hz', '100\u00a0Hz', '1\u00a0kHz', '10\u00a0kHz', '100\u00a0kHz', '1\u00a0MHz']);
    expect(ticks.filter((t) => !t.major)).toHaveLength(6 * 8);
    expect(ticks.filter((t) => !t.major).every((t) => t.label === null)).toBe(true);
  });

  it('logTicks over 14 decades drops the minors and labels every other decade when maxLabels is 8', () => {
    const ticks = logTicks([1e-8, 1e6], 8, formatPowerOfTen);
    expect(ticks.every((t) => t.major)).toBe(true);
    expect(ticks).toHaveLength(15);
    expect(ticks.filter((t) => t.label !== null).map((t) => t.value)).toEqual([1e-8, 1e-6, 1e-4, 1e-2, 1, 1e2, 1e4, 1e6]);
    expect(ticks.filter((t) => t.label !== null).map((t) => t.label)).toEqual(['10⁻⁸', '10⁻⁶', '10⁻⁴', '0.01', '1', '100', '10⁴', '10⁶']);
  });

  it('logTicks zoomed under a decade labels the minor ticks', () => {
    const ticks = logTicks([2e3, 8e3], 8, formatFrequencyTick);
    expect(ticks.map((t) => t.value)).toEqual([2e3, 3e3, 4e3, 5e3, 6e3, 7e3, 8e3]);
    expect(ticks.every((t) => t.label !== null)).toBe(true);
  });

  it('logTicks([7, 700]) with two decades on the axis labels 2 and 5 as well', () => {
    const ticks = logTicks([7, 700], 8, formatPowerOfTen);
    expect(ticks.filter((t) => t.label !== null).map((t) => t.value)).toEqual([10, 20, 50, 100, 200, 500]);
  });

  it('logTicks over about a decade labels 2 and 5 between the decades', () => {
    const ticks = logTicks([1e3, 2e4], 8, formatFrequencyTick);
    expect(ticks.filter((t) => t.label !== null).map((t) => t.value)).toEqual([1e3, 2e3, 5e3, 1e4, 2e4]);
  });

  it('logTicks of a non-positive domain is empty', () => {
    expect(logTicks([0, 10], 5, String)).toEqual([]);
  });
});

describe('formatPowerOfTen and linearTicks', () => {
  it('formatPowerOfTen writes 10⁴, 10⁻³ and 2·10⁴, and 0.05, 1, 10, 200 as plain numbers', () => {
    expect(formatPowerOfTen(1e4)).toBe('10⁴');
    expect(formatPowerOfTen(1e-3)).toBe('10⁻³');
    expect(formatPowerOfTen(2e4)).toBe('2·10⁴');
    expect(formatPowerOfTen(0.05)).toBe('0.05');
    expect(formatPowerOfTen(1)).toBe('1');
    expect(formatPowerOfTen(10)).toBe('10');
    expect(formatPowerOfTen(200)).toBe('200');
  });

  it('linearTicks([−143, −61], 4) steps by 20 dB', () => {
    expect(linearTicks([-143, -61], 4, String).map((t) => t.value)).toEqual([-140, -120, -100, -80]);
  });
});
