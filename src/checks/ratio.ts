/**
 * Component ratios as records write them: `a:b[:c…]` with optional per-part percent signs (`97.5%:2.5%`), or a
 * single percentage (`95%`, read as 95:5). Bad input is data: problems come back with the character offset.
 */

export interface ParsedRatio {
  parts: number[];
  /** The parts were written as percentages ('%'), or a single percentage was given. */
  percent: boolean;
  /** Parts look like percentages: written with '%', or plain numbers summing to between 80 and 120. */
  looksLikePercent: boolean;
  problems: { offset: number; message: string }[];
}

export function parseRatio(text: string): ParsedRatio {
  const out: ParsedRatio = { parts: [], percent: false, looksLikePercent: false, problems: [] };
  const trimmed = text.trim();
  if (trimmed === '') {
    out.problems.push({ offset: 0, message: 'the ratio is empty' });
    return out;
  }
  const single = /^(\d+(?:\.\d+)?)\s*%$/.exec(trimmed);
  if (single) {
    const v = Number(single[1]);
    if (v > 100) out.problems.push({ offset: text.indexOf(single[1]), message: `${v}% is more than 100%` });
    out.parts = [v, Math.max(0, 100 - v)];
    out.percent = true;
    out.looksLikePercent = true;
    return out;
  }
  let offset = 0;
  const pieces = text.split(/[:\u2236]/);
  let withPercent = 0;
  for (const piece of pieces) {
    const lead = piece.length - piece.trimStart().length;
    const p = piece.trim();
    const m = /^(\d+(?:\.\d+)?)\s*(%?)$/.exec(p);
    if (!m) {
      const hint = /^\d+,\d+%?$/.test(p) ? " (use '.' as the decimal mark)" : '';
      out.problems.push({
        offset: offset + lead,
        message: p === '' ? 'a part of the ratio is missing' : `'${p}' is not a number${hint}`,
      });
    } else {
      out.parts.push(Number(m[1]));
      if (m[2]) withPercent++;
    }
    offset += piece.length + 1;
  }
  if (pieces.length < 2 && out.problems.length === 0) {
    out.problems.push({
      offset: 0,
      message: "a ratio needs two or more parts separated by ':' (e.g. 70:30)",
    });
  }
  if (withPercent > 0 && withPercent < pieces.length) {
    out.problems.push({ offset: 0, message: "some parts carry '%' and others do not" });
  }
  out.percent = withPercent > 0;
  const sum = out.parts.reduce((a, b) => a + b, 0);
  if (out.problems.length === 0 && out.parts.length >= 2 && sum === 0) {
    // every part zero: no amount of anything, so no ratio (and no ee) can be read from it
    out.problems.push({ offset: 0, message: 'every part is zero, so it states no proportion' });
  }
  out.looksLikePercent = out.percent || (sum >= 80 && sum <= 120);
  return out;
}

/** ee in percent from an enantiomer ratio a:b (IUPAC Gold Book, enantiomer excess: |a − b| / (a + b) · 100). */
export function eeFromRatio(a: number, b: number): number | null {
  return a + b > 0 ? (Math.abs(a - b) / (a + b)) * 100 : null;
}
