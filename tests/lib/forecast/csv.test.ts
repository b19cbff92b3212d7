/**
 * The weather CSV parser. The well-formed files below were written by hand following our documented format
 * (lib/forecast/csv.ts: header time,ghi_w_m2[,dni_w_m2,dhi_w_m2,temp_c,wind_m_s,cloud_okta]; time ISO 8601 with
 * its UTC offset, the start of the hour). Broken files must fail with the line and the field.
 */
import { describe, expect, it } from 'vitest';
import { parseIsoWithOffset, parseWeatherCsv } from '@/lib/forecast/csv';

const H = 3_600_000;

describe('parseIsoWithOffset', () => {
  it('reads offsets with and without a colon, and Z', () => {
    expect(parseIsoWithOffset('2026-12-03T10:00+03:00')).toEqual({ ms: Date.UTC(2026, 11, 3, 7) });
    expect(parseIsoWithOffset('2026-12-03T10:00+0300')).toEqual({ ms: Date.UTC(2026, 11, 3, 7) });
    expect(parseIsoWithOffset('2026-12-03T10:00:00Z')).toEqual({ ms: Date.UTC(2026, 11, 3, 10) });
    expect(parseIsoWithOffset('2026-12-03T10:00-05:00')).toEqual({ ms: Date.UTC(2026, 11, 3, 15) });
    expect(parseIsoWithOffset('2026-12-03T10:00+05:30')).toEqual({ ms: Date.UTC(2026, 11, 3, 4, 30) });
  });

  it('explains what is wrong', () => {
    expect(parseIsoWithOffset('2026-12-03T10:00')).toEqual({ error: expect.stringMatching(/Add the UTC offset/) });
    expect(parseIsoWithOffset('03/12/2026 10:00')).toEqual({ error: expect.stringMatching(/ISO 8601/) });
    expect(parseIsoWithOffset('2026-02-30T10:00Z')).toEqual({ error: expect.stringMatching(/Not a real date/) });
    expect(parseIsoWithOffset('2026-12-03T25:00Z')).toEqual({ error: expect.stringMatching(/Not a real date/) });
    expect(parseIsoWithOffset('2026-12-03T10:30Z')).toEqual({ error: expect.stringMatching(/on the hour/) });
  });
});

describe('parseWeatherCsv — well-formed (written by hand after the documented format)', () => {
  it('reads every column, in any order, with empty optional cells; sorts by time', () => {
    const text = [
      'time,temp_c,ghi_w_m2,dni_w_m2,dhi_w_m2,wind_m_s,cloud_okta',
      '2026-12-03T10:00+03:00,26.0,780,790,150,2.4,1',
      '2026-12-03T09:00+03:00,24.5,610,720,140,2.1,1',
      '',
      '2026-12-03T11:00+03:00,,850,,,3,',
    ].join('\r\n');
    const p = parseWeatherCsv(text);
    expect(p.issues).toEqual([]);
    expect(p.hours.map((h) => h.t)).toEqual([Date.UTC(2026, 11, 3, 6), Date.UTC(2026, 11, 3, 7), Date.UTC(2026, 11, 3, 8)]);
    expect(p.hours[0]).toEqual({ t: Date.UTC(2026, 11, 3, 6), ghiWm2: 610, dniWm2: 720, dhiWm2: 140, tAirC: 24.5, windMS: 2.1, cloudOkta: 1 });
    const last = p.hours[2]!;
    expect(last.ghiWm2).toBe(850);
    expect(last.dniWm2).toBeUndefined();
    expect(Number.isNaN(last.tAirC)).toBe(true); // no temperature: the caller fills a daily cycle
    expect(last.windMS).toBe(3);
  });

  it('needs only time and ghi_w_m2; a byte-order mark and upper-case header are fine', () => {
    const p = parseWeatherCsv('\uFEFFTIME,GHI_W_M2\n2026-12-03T00:00Z,0\n2026-12-03T01:00Z,0\n');
    expect(p.issues).toEqual([]);
    expect(p.hours).toHaveLength(2);
    expect(p.hours[1]!.t - p.hours[0]!.t).toBe(H);
  });
});

describe('parseWeatherCsv — broken files', () => {
  const issues = (text: string) => parseWeatherCsv(text).issues.map((i) => `line ${i.line}.${i.field}: ${i.message}`);

  it('wrong column count', () => {
    expect(issues('time,ghi_w_m2,temp_c\n2026-12-03T10:00Z,500\n')).toEqual(['line 2.(row): Expected 3 fields as in the header, found 2.']);
  });

  it('bad timestamps', () => {
    const r = issues('time,ghi_w_m2\n2026-12-03 10:00,500\nyesterday,1\n2026-13-03T10:00Z,1\n,1\n');
    expect(r).toHaveLength(4);
    expect(r[0]).toMatch(/^line 2\.time: Use an ISO 8601 time/);
    expect(r[1]).toMatch(/^line 3\.time: Use an ISO 8601 time/);
    expect(r[2]).toMatch(/^line 4\.time: Not a real date/);
    expect(r[3]).toMatch(/^line 5\.time: The time is missing/);
  });

  it('units out of range, with the unit in the message', () => {
    const r = issues('time,ghi_w_m2,temp_c,cloud_okta,wind_m_s\n2026-12-03T10:00Z,1800,80,9,-1\n');
    expect(r).toEqual([
      'line 2.ghi_w_m2: Must be between 0 and 1500 W/m²; got 1800.',
      'line 2.temp_c: Must be between -60 and 60 °C; got 80.',
      'line 2.cloud_okta: Must be between 0 and 8 okta; got 9.',
      'line 2.wind_m_s: Must be between 0 and 60 m/s; got -1.',
    ]);
  });

  it('not a number; global irradiance missing; diffuse above global', () => {
    const r = issues('time,ghi_w_m2,dhi_w_m2,dni_w_m2\n2026-12-03T10:00Z,lots,1,1\n2026-12-03T11:00Z,,1,1\n2026-12-03T12:00Z,300,400,100\n');
    expect(r).toEqual([
      'line 2.ghi_w_m2: Not a number: "lots" (W/m²).',
      'line 3.ghi_w_m2: Global irradiance is required on every line.',
      'line 4.dhi_w_m2: Diffuse irradiance (400 W/m²) cannot exceed global irradiance (300 W/m²).',
    ]);
  });

  it('duplicate hours, also when written with different offsets', () => {
    const r = issues('time,ghi_w_m2\n2026-12-03T10:00+03:00,500\n2026-12-03T07:00Z,500\n2026-12-03T10:00+03:00,1\n');
    expect(r).toEqual(['line 3.time: The same hour as line 2; give each hour once.', 'line 4.time: The same hour as line 2; give each hour once.']);
  });

  it('hours that do not line up', () => {
    expect(issues('time,ghi_w_m2\n2026-12-03T10:00Z,1\n2026-12-03T10:00+05:30,1\n')).toEqual([
      "line 3.time: Not a whole number of hours after line 2; the hours must line up.",
    ]);
  });

  it('header problems: unknown or repeated column, a required one missing, an empty file', () => {
    expect(issues('time,ghi,temp_c\n')).toEqual([
      'line 1.ghi: Unknown column; the columns are time, ghi_w_m2, dni_w_m2, dhi_w_m2, temp_c, wind_m_s, cloud_okta.',
      'line 1.ghi_w_m2: The header needs a "ghi_w_m2" column.',
    ]);
    expect(issues('time,ghi_w_m2,ghi_w_m2\n')).toEqual(['line 1.ghi_w_m2: This column appears twice.']);
    expect(issues('\n\n')).toEqual(['line 1.(file): The file is empty.']);
    expect(issues('time,ghi_w_m2\n')).toEqual(['line 2.(file): The file has a header but no hours.']);
  });

  it('keeps the first 20 problems and counts them all', () => {
    const rows = Array.from({ length: 50 }, (_, i) => `2026-12-0${3 + Math.floor(i / 24)}T${String(i % 24).padStart(2, '0')}:00Z,-5`);
    const p = parseWeatherCsv(['time,ghi_w_m2', ...rows].join('\n'));
    expect(p.issues).toHaveLength(20);
    expect(p.issueCount).toBe(50);
    expect(p.issues[19]!.line).toBe(21);
    expect(p.hours).toEqual([]);
  });
});

describe('parseWeatherCsv — quoting and line ends (RFC 4180, Shafranovich 2005, sections 2.5–2.7)', () => {
  const issues = (text: string) => parseWeatherCsv(text).issues.map((i) => `line ${i.line}.${i.field}: ${i.message}`);

  it('a quoted field may hold a comma: it stays one field, and its text is reported whole', () => {
    // "1,5" is one field (RFC 4180 §2.6), so the row has 2 fields like its header and the cell is not a number.
    expect(issues('time,ghi_w_m2\n2026-12-03T10:00Z,"1,5"\n')).toEqual(['line 2.ghi_w_m2: Not a number: "1,5" (W/m²).']);
    const p = parseWeatherCsv('"time","ghi_w_m2"\n"2026-12-03T10:00Z","500"\n');
    expect(p.issues).toEqual([]);
    expect(p.hours).toEqual([{ t: Date.UTC(2026, 11, 3, 10), ghiWm2: 500, tAirC: Number.NaN }]);
  });

  it('a byte-order mark before a quoted header is not part of the first column name', () => {
    const p = parseWeatherCsv('\uFEFF"time",ghi_w_m2\r\n2026-12-03T10:00Z,500\r\n');
    expect(p.issues).toEqual([]);
    expect(p.hours).toHaveLength(1);
  });

  it('CRLF line ends: no carriage return left in the last cell, and line numbers count CRLF once', () => {
    const p = parseWeatherCsv('time,ghi_w_m2,temp_c\r\n2026-12-03T10:00Z,500,21.5\r\n\r\n2026-12-03T11:00Z,600,x\r\n');
    expect(p.hours).toEqual([{ t: Date.UTC(2026, 11, 3, 10), ghiWm2: 500, tAirC: 21.5 }]);
    expect(p.issues).toEqual([{ line: 4, field: 'temp_c', message: 'Not a number: "x" (°C).' }]);
  });

  it('old Mac CR-only and mixed line ends read like LF', () => {
    const p = parseWeatherCsv('time,ghi_w_m2\r2026-12-03T10:00Z,1\n2026-12-03T11:00Z,2\r\n2026-12-03T12:00Z,3');
    expect(p.issues).toEqual([]);
    expect(p.hours.map((h) => h.ghiWm2)).toEqual([1, 2, 3]);
  });

  it('a quoted line break keeps the following line numbers true to the file', () => {
    // Record 2 spans lines 2–3 (RFC 4180 §2.6); the next record starts on line 4.
    expect(issues('time,ghi_w_m2\n"2026-12-03\nT10:00Z",1\n2026-12-03T11:00Z,-1\n')).toEqual([
      'line 2.time: Use an ISO 8601 time with its offset, e.g. 2026-12-03T10:00+03:00.',
      'line 4.ghi_w_m2: Must be between 0 and 1500 W/m²; got -1.',
    ]);
  });

  it('a quote that is never closed is reported at the line it opens', () => {
    const r = issues('time,ghi_w_m2\n2026-12-03T10:00Z,1\n2026-12-03T11:00Z,"2\n');
    expect(r).toEqual(['line 3.(row): A quoted field is not closed; end it with a double quote (").']);
  });
});
