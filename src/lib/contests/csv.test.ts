import { parse } from 'csv-parse/sync';
import { describe, expect, test } from 'vitest';
import { csvFileName, inertText, toCsv } from './csv';

// References: RFC 4180 ("Common Format and MIME Type for CSV Files") §2 for quoting, doubling of
// quotes and CRLF; the Unicode byte-order mark EF BB BF for UTF-8; OWASP "CSV Injection" for
// formula-leading cells. csv-parse (an independent parser from npm) reads the output back.

describe('toCsv', () => {
	test('starts with the UTF-8 byte-order mark and ends rows with CRLF', () => {
		const csv = toCsv(['a', 'b'], [[1, 'x']]);
		expect([...Buffer.from(csv, 'utf8').subarray(0, 3)]).toEqual([0xef, 0xbb, 0xbf]);
		expect(csv.slice(1)).toBe('a,b\r\n1,x\r\n');
	});
	test('fields with commas, quotes and line breaks are quoted and read back intact', () => {
		const tricky = ['Green, red and "bronze"', 'two\nlines', 'Sefa Lindqvoss — ünïcode', ' padded ', 7.5, null, true];
		const csv = toCsv(['c1', 'c2', 'c3', 'c4', 'c5', 'c6', 'c7'], [tricky]);
		expect(csv).toContain('"Green, red and ""bronze"""'); // RFC 4180 §2.7: quotes doubled inside quotes
		const rows = parse(csv, { bom: true }) as string[][];
		expect(rows[1]).toEqual(['Green, red and "bronze"', 'two\nlines', 'Sefa Lindqvoss — ünïcode', ' padded ', '7.5', '', 'yes']);
	});
	test('text that a spreadsheet would run as a formula is made inert; numbers are not touched', () => {
		expect(inertText('=HYPERLINK("x")')).toBe(`'=HYPERLINK("x")`);
		expect(inertText('+1')).toBe("'+1");
		expect(inertText('@sum')).toBe("'@sum");
		expect(inertText('-2')).toBe("'-2");
		expect(inertText('Plain')).toBe('Plain');
		const rows = parse(toCsv(['z', 'note'], [[-0.75, '=1+1']]), { bom: true }) as string[][];
		expect(rows[1]).toEqual(['-0.75', "'=1+1"]);
	});
	test('file names', () => {
		expect(csvFileName('Kettlewater Spring Scapes 2026', 'results')).toBe('kettlewater-spring-scapes-2026-results.csv');
		expect(csvFileName('Café “Nano” / Open', 'cards')).toBe('cafe-nano-open-cards.csv');
		expect(csvFileName('???', 'cards')).toBe('contest-cards.csv');
	});
});
