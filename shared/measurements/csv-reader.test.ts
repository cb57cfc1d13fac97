/**
 * CSV reading. Format facts: RFC 4180 (Shafranovich, 2005) quoting, where a quoted field may hold
 * the delimiter and line breaks; European spreadsheet locales write decimal commas and then use
 * ";" as the list separator (common practice, no source).
 */
import { describe, expect, test } from 'vitest';
import { detectDecimal, detectDelimiter, normaliseText, parseNumberCell, readRecords } from './csv-reader';

describe('detectDelimiter', () => {
  test.each([
    ['T (K),B2 (cm3/mol)\n300,-15\n400,-1\n', ','],
    ['T (K);B2 (cm3/mol)\n300;-15\n400;-1\n', ';'],
    ['T (K);B2 (cm3/mol)\n300,5;-15,25\n400;-1,5\n', ';'],
    ['T (K)\tB2 (cm3/mol)\n300,5\t-15,25\n', '\t'],
    ['T (K)\tB2 (cm3/mol)\n300.5\t-15.25\n', '\t'],
    ['# comment; with, delimiters\tinside\nT (K),B2 (cm3/mol)\n300,-15\n', ','],
    ['T (K),B2 (cm3/mol),note\n300,-15,"a; b"\n', ','],
  ])('%j → %j', (text, expected) => {
    expect(detectDelimiter(normaliseText(text))).toBe(expected);
  });
});

describe('detectDecimal', () => {
  const rec = (rows: string[][]) => rows.map((cells, i) => ({ line: i + 2, cells }));
  test('decimal comma only for non-comma delimiters and only without dot decimals', () => {
    expect(detectDecimal(rec([['300,5', '-15,25']]), ';')).toBe(',');
    expect(detectDecimal(rec([['300', '-15']]), ';')).toBe('.');
    expect(detectDecimal(rec([['300,5', '-15.25']]), ';')).toBe('.');
    expect(detectDecimal(rec([['300,5', '-15,25']]), ',')).toBe('.');
    expect(detectDecimal(rec([['1,5e3']]), '\t')).toBe(',');
  });
});

describe('parseNumberCell', () => {
  test.each([
    ['300', '.', 300],
    [' 300.15 ', '.', 300.15],
    ['-15.25', '.', -15.25],
    ['+2', '.', 2],
    ['.5', '.', 0.5],
    ['1e3', '.', 1000],
    ['1.5E-02', '.', 0.015],
    ['\u22125', '.', -5],
    ['1,5', ',', 1.5],
    ['-0,25e1', ',', -2.5],
  ])('%j with decimal %j → %d', (text, decimal, value) => {
    expect(parseNumberCell(text, decimal as '.' | ',')).toEqual({ ok: true, value });
  });
  test.each([
    ['abc', '.'],
    ['n/a', '.'],
    ['1.2.3', '.'],
    ['Infinity', '.'],
    ['NaN', '.'],
    ['1e999', '.'],
    ['0x10', '.'],
    ['1 234', '.'],
    ['1,5', '.'],
    ['1.234,5', ','],
    ['1.5', ','],
  ])('%j with decimal %j is rejected', (text, decimal) => {
    expect(parseNumberCell(text, decimal as '.' | ',').ok).toBe(false);
  });
});

describe('readRecords', () => {
  test('line numbers count comments, blank lines and line breaks inside quoted cells', () => {
    const text = normaliseText('# c1\r\nT (K),note\r\n\r\n300,"a\r\nb"\r\n,\r\n# c2\r\n400,x');
    const { records, errors } = readRecords(text, ',');
    expect(errors).toEqual([]);
    expect(records).toEqual([
      { line: 2, cells: ['T (K)', 'note'] },
      { line: 4, cells: ['300', 'a\nb'] },
      { line: 8, cells: ['400', 'x'] },
    ]);
  });
  test('an unclosed quote is a syntax error with its line', () => {
    const { errors } = readRecords(normaliseText('T (K),note\n300,"open\n400,x\n'), ',');
    expect(errors.length).toBeGreaterThan(0);
    expect(errors[0].line).toBe(2);
  });
});
