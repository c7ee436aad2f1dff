import { describe, expect, it } from 'vitest';
import { fahrenheitToC, mapColumns, parseClock, previewLog, LAB_LOG_MAX_ROWS } from '@shared/lab-logs';

describe('logger CSV reading', () => {
  it('°F converts by (F − 32)·5/9: 32 °F = 0 °C, 212 °F = 100 °C, −40 °F = −40 °C (NIST SP 811 §B.8)', () => {
    expect(fahrenheitToC(32)).toBe(0);
    expect(fahrenheitToC(212)).toBe(100);
    expect(fahrenheitToC(-40)).toBe(-40);
  });

  it('minutes become seconds and °F becomes °C through the mapping', () => {
    const p = previewLog('elapsed (min),pack (°F)\n0,77\n0.5,59\n1,41\n1.5,35.6\n2,33.8\n');
    expect(p.suggested).toEqual({ timeColumn: 0, timeUnit: 'min', tempColumns: [1], tempUnit: 'F' });
    const m = mapColumns(p, p.suggested!);
    expect(m.errors).toEqual([]);
    expect(m.samples.map((s) => s.tSec)).toEqual([0, 30, 60, 90, 120]);
    expect(m.samples.map((s) => Math.round(s.tempsC[0]! * 1000) / 1000)).toEqual([25, 15, 5, 2, 1]);
  });

  it('clock times with dates, without dates, with AM/PM, and across midnight give seconds from the first sample', () => {
    expect(parseClock('2025-03-14 09:58:30')!.seconds - parseClock('2025-03-14 09:58:00')!.seconds).toBe(30);
    expect(parseClock('14/03/2025 10:00:00')!.seconds - parseClock('2025-03-14T09:59:00')!.seconds).toBe(60);
    expect(parseClock('03/14/2025 10:00:00')!.seconds).toBe(parseClock('2025-03-14 10:00:00')!.seconds);
    expect(parseClock('1:05:00 PM')!.seconds).toBe(13 * 3600 + 300);
    expect(parseClock('12:00:00 AM')!.seconds).toBe(0);
    expect(parseClock('25:00:00')).toBeNull();
    const p = previewLog('time;T1;T2\n23:59:30;20,5;21\n23:59:45;19,5;21\n00:00:00;18,5;21\n00:00:15;17,5;21\n00:00:30;16,5;21\n');
    expect(p.delimiter).toBe(';');
    const m = mapColumns(p, { timeColumn: 0, timeUnit: 'clock', tempColumns: [1, 2], tempUnit: 'C' });
    expect(m.errors).toEqual([]);
    expect(m.samples.map((s) => s.tSec)).toEqual([0, 15, 30, 45, 60]);
    expect(m.samples[1]!.tempsC).toEqual([19.5, 21]);
  });

  it('a preamble above the header is kept apart, tabs are detected, and the chosen columns are what is read', () => {
    const text = 'Device\tTL-2\nSerial\t17\n\nNo.\tTime\tProbe A (°C)\tProbe B (°C)\n1\t0\t24\t24.5\n2\t10\t20\t24.4\n3\t20\t16\t24.3\n4\t30\t12\t24.2\n5\t40\t9\t24.1\n';
    const p = previewLog(text);
    expect(p.delimiter).toBe('\t');
    expect(p.headerRow).toBe(4);
    expect(p.preamble).toEqual(['Device TL-2', 'Serial 17']);
    expect(p.suggested!.timeColumn).toBe(1);
    const m = mapColumns(p, { timeColumn: 1, timeUnit: 's', tempColumns: [3], tempUnit: 'C' });
    expect(m.channels).toEqual(['Probe B (°C)']);
    expect(m.samples.map((s) => s.tempsC[0])).toEqual([24.5, 24.4, 24.3, 24.2, 24.1]);
  });

  it('row errors carry the file line: unreadable cells, time going back, impossible readings, too few samples', () => {
    const p = previewLog('t,T\n0,20\n10,abc\n20,18\n15,17\n30,900\n40,15\n');
    const m = mapColumns(p, { timeColumn: 0, timeUnit: 's', tempColumns: [1], tempUnit: 'C' });
    expect(m.errors.map((e) => e.row)).toEqual([3, 5, 6]);
    expect(m.errors[0]!.message).toMatch(/expected a temperature in °C, found "abc"/);
    expect(m.errors[1]!.message).toMatch(/expected time to increase/);
    expect(m.errors[2]!.message).toMatch(/between -80 and 200 °C/);
    const few = mapColumns(previewLog('t,T\n0,20\n10,19\n'), { timeColumn: 0, timeUnit: 's', tempColumns: [1], tempUnit: 'C' });
    expect(few.errors[0]!.message).toMatch(/at least 5 samples/);
    const none = previewLog('hello\nworld\n');
    expect(none.errors[0]!.message).toMatch(/found none/);
  });

  it(`more than ${LAB_LOG_MAX_ROWS} data rows is an error`, () => {
    const rows = Array.from({ length: LAB_LOG_MAX_ROWS + 1 }, (_, i) => `${i},20`);
    const p = previewLog(`t,T\n${rows.join('\n')}\n`);
    expect(p.errors[0]!.message).toMatch(/at most 50,000 data rows/);
  });

  it('a mapping naming a column that does not exist, or time as temperature, is refused', () => {
    const p = previewLog('t,T\n0,20\n1,19\n2,18\n3,17\n4,16\n');
    expect(mapColumns(p, { timeColumn: 0, timeUnit: 's', tempColumns: [4], tempUnit: 'C' }).errors[0]!.message).toMatch(/column numbers 0 to 1/);
    expect(mapColumns(p, { timeColumn: 0, timeUnit: 's', tempColumns: [0], tempUnit: 'C' }).errors[0]!.message).toMatch(/cannot also be/);
  });
});
