// Spreadsheet formula neutralisation for every CSV the product writes, and its exact inverse for
// the import. A text cell that a spreadsheet would run as a formula (first character `=`, `+`,
// `-`, `@`, tab or carriage return, the OWASP "CSV injection" list) gets a leading apostrophe,
// which spreadsheets show as text. Cells that already start with apostrophes before such a
// character get one more, so reading strips exactly one and every value round-trips. A plain
// negative number (`-4.5`) cannot run as a formula and stays a number.

const RISKY = String.raw`(?:[=+@\t\r]|-(?!\d+(?:\.\d+)?$))`;
const FORMULA_START = new RegExp(`^'*${RISKY}`);
const ESCAPED = new RegExp(`^'+${RISKY}`);

/** The papaparse `escapeFormulae` setting for `Papa.unparse`. */
export const escapeFormulae = FORMULA_START;

/** Undo the export's escape: `'=1+2` reads back as `=1+2`. Only ever removes one apostrophe. */
export function unescapeCell(value: string): string {
  return ESCAPED.test(value) ? value.slice(1) : value;
}
