// Chemical formulas: parse element symbols with counts and nested parentheses, write them back in Hill order,
// and sum exact masses. Monoisotopic mass = Σ count × mass of the element's most abundant isotope (IUPAC
// Gold Book, "monoisotopic mass"); electron mass CODATA 2018 (E. Tiesinga et al., Rev. Mod. Phys. 93 (2021) 025010).
import { ELEMENT_ISOTOPES } from './elementData';

/** Electron mass in u, CODATA 2018: 5.485 799 090 65(16) × 10⁻⁴ u. */
export const ELECTRON_MASS_U = 5.48579909065e-4;

/** Largest count accepted for one group and the largest total number of atoms (keeps patterns fast and finite). */
export const MAX_ATOMS = 100000;

/** Element symbols the module knows, in table order. */
export const KNOWN_ELEMENTS: readonly string[] = Object.keys(ELEMENT_ISOTOPES);

function fail(text: string, position: number, reason: string): never {
  throw new Error(`Formula "${text}", position ${position + 1}: ${reason}`);
}

/**
 * Element counts of a formula such as `C9F20N`, `(CH3)3SiOH` or `Xe`. Symbols are one capital and an optional
 * small letter; counts are positive whole numbers; parentheses nest. Throws an Error naming the position
 * (1-based) and the reason for anything else.
 */
export function parseFormula(text: string): Record<string, number> {
  if (typeof text !== 'string') throw new Error(`Formula: expected text, got ${text === null ? 'null' : typeof text}`);
  if (text.trim() === '') throw new Error('Formula: empty; write element symbols with counts, e.g. C9F20N or (CH3)3SiOH');
  let i = 0;
  const readCount = (): number => {
    const start = i;
    while (i < text.length && text[i] >= '0' && text[i] <= '9') i++;
    if (i === start) return 1;
    const digits = text.slice(start, i);
    if (digits[0] === '0') fail(text, start, `count "${digits}" must be a whole number from 1 to ${MAX_ATOMS} without a leading zero`);
    const n = Number(digits);
    if (n > MAX_ATOMS) fail(text, start, `count ${digits} is above the limit of ${MAX_ATOMS}`);
    return n;
  };
  const group = (depth: number, open: number): Map<string, number> => {
    const counts = new Map<string, number>();
    const add = (symbol: string, n: number): void => {
      counts.set(symbol, (counts.get(symbol) ?? 0) + n);
    };
    let empty = true;
    while (i < text.length) {
      const c = text[i];
      if (c === '(') {
        const at = i;
        i++;
        const inner = group(depth + 1, at);
        if (text[i] !== ')') fail(text, at, 'this "(" is never closed');
        i++;
        const n = readCount();
        for (const [symbol, m] of inner) add(symbol, m * n);
        empty = false;
      } else if (c === ')') {
        if (depth === 0) fail(text, i, 'a ")" with no "(" before it');
        if (empty) fail(text, i, 'empty parentheses');
        return counts;
      } else if (c >= 'A' && c <= 'Z') {
        const at = i;
        let symbol = c;
        i++;
        if (i < text.length && text[i] >= 'a' && text[i] <= 'z') symbol += text[i++];
        if (!(symbol in ELEMENT_ISOTOPES)) {
          fail(text, at, `unknown element "${symbol}" (known: ${KNOWN_ELEMENTS.join(', ')})`);
        }
        add(symbol, readCount());
        empty = false;
      } else if (c >= '0' && c <= '9') {
        fail(text, i, 'a count must follow an element symbol or a ")"');
      } else if (c >= 'a' && c <= 'z') {
        fail(text, i, `"${c}" cannot start an element symbol; symbols start with a capital letter`);
      } else {
        fail(text, i, `character "${c}" is not allowed; use element symbols, counts and parentheses only`);
      }
    }
    if (depth > 0) fail(text, open, 'this "(" is never closed');
    return counts;
  };
  const counts = group(0, 0);
  let total = 0;
  const result: Record<string, number> = {};
  for (const [symbol, n] of counts) {
    result[symbol] = n;
    total += n;
  }
  if (total > MAX_ATOMS) throw new Error(`Formula "${text}": ${total} atoms in all, above the limit of ${MAX_ATOMS}`);
  return result;
}

/** Writes element counts as a formula in Hill order (C, then H, then the rest alphabetically; no C: all alphabetical). */
export function formatFormula(counts: Record<string, number>): string {
  const symbols = Object.keys(counts).filter((s) => counts[s] > 0);
  const hasCarbon = symbols.includes('C');
  symbols.sort((x, y) => {
    const rank = (s: string): number => (hasCarbon ? (s === 'C' ? 0 : s === 'H' ? 1 : 2) : 2);
    return rank(x) - rank(y) || (x < y ? -1 : x > y ? 1 : 0);
  });
  return symbols.map((s) => (counts[s] === 1 ? s : `${s}${counts[s]}`)).join('');
}

/** Mass in u of the element's most abundant stable isotope. */
export function mostAbundantIsotopeMass(symbol: string): number {
  const rows = ELEMENT_ISOTOPES[symbol];
  if (!rows) throw new Error(`Element "${symbol}" is not in the table (known: ${KNOWN_ELEMENTS.join(', ')})`);
  let best = rows[0];
  for (const row of rows) if (row[2] > best[2]) best = row;
  return best[1];
}

function massOfCounts(counts: Record<string, number>): number {
  let mass = 0;
  for (const symbol of Object.keys(counts)) mass += counts[symbol] * mostAbundantIsotopeMass(symbol);
  return mass;
}

/** Neutral monoisotopic mass in u (most abundant isotope of each element). */
export function monoisotopicMass(formula: string): number {
  return massOfCounts(parseFormula(formula));
}

/** Checks a charge number: a non-zero whole number from −100 to 100. */
export function checkCharge(charge: number): number {
  if (typeof charge !== 'number' || !Number.isInteger(charge) || charge === 0 || Math.abs(charge) > 100) {
    throw new Error(`charge = ${String(charge)} is out of range; accepted: a non-zero whole number from -100 to 100`);
  }
  return charge;
}

/** m/z of a neutral mass M (u) as an ion of charge z: cation (M − z·mₑ)/z, anion (M + |z|·mₑ)/|z|. */
export function massToMz(mass: number, charge: number): number {
  const z = checkCharge(charge);
  return (mass - z * ELECTRON_MASS_U) / Math.abs(z);
}

/** Monoisotopic m/z of the formula as an ion of the given charge (default +1; electrons removed or added). */
export function ionMz(formula: string, charge = 1): number {
  checkCharge(charge);
  return massToMz(monoisotopicMass(formula), charge);
}
