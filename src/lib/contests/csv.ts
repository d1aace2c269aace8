// CSV for spreadsheet programs: RFC 4180 quoting by csv-stringify, CRLF line ends, UTF-8 with a
// byte-order mark (without it some spreadsheet programs read UTF-8 as a legacy code page and
// garble names like "Lindqvoss" with accents), and text cells that a spreadsheet would run as a
// formula made inert.
import { stringify } from 'csv-stringify/sync';

export type Cell = string | number | boolean | null | undefined;

/**
 * Text starting with one of these is read as a formula by common spreadsheet programs; a leading
 * apostrophe makes it plain text (the defence the OWASP "CSV Injection" page recommends).
 * Only text cells are changed: a negative number stays a number.
 */
const FORMULA_START = /^[=+\-@\t\r]/;

export function inertText(value: string): string {
	return FORMULA_START.test(value) ? `'${value}` : value;
}

function cell(value: Cell): string | number {
	if (value === null || value === undefined) return '';
	if (typeof value === 'boolean') return value ? 'yes' : 'no';
	if (typeof value === 'number') return Number.isFinite(value) ? value : '';
	return inertText(value);
}

export const CSV_MIME = 'text/csv; charset=utf-8';

/** A whole CSV file: header row, then rows. */
export function toCsv(header: readonly string[], rows: readonly (readonly Cell[])[]): string {
	return stringify([header.map(cell), ...rows.map((r) => r.map(cell))], { bom: true, record_delimiter: 'windows', quoted_match: /^\s|\s$/ });
}

/** A file name without characters that trouble a download dialog: "spring-scapes-2026-results.csv". */
export function csvFileName(title: string, what: string): string {
	const slug = title
		.normalize('NFKD')
		.replace(/[\u0300-\u036f]/g, '')
		.toLowerCase()
		.replace(/[^a-z0-9]+/g, '-')
		.replace(/^-|-$/g, '')
		.slice(0, 60);
	return `${slug || 'contest'}-${what}.csv`;
}
