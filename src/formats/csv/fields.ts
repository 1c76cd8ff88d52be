// Splitting lines into fields for the slow paths (detection, header, preview, rejected rows): quotes as in
// RFC 4180, blanks trimmed, and runs of spaces and tabs as one delimiter (WS).

/** The delimiter code for "runs of spaces and tabs"; other delimiters are their character codes. */
export const WS = -1;

/** The fields of one line (quotes removed, blanks trimmed); `delim` is a char code or WS for runs of blanks. */
export function splitFields(line: string, delim: number): string[] {
  const out: string[] = [];
  const e = line.length;
  let p = 0;
  const blank = (c: number) => c === 32 || (c === 9 && delim !== 9);
  if (delim === WS) {
    while (p < e) {
      while (p < e && isBlank(line.charCodeAt(p))) p++;
      if (p >= e) break;
      if (line.charCodeAt(p) === 34) {
        const q = closingQuote(line, p + 1, e);
        out.push(unquote(line.slice(p + 1, q)));
        p = q + 1;
        while (p < e && !isBlank(line.charCodeAt(p))) p++;
      } else {
        const fs = p;
        while (p < e && !isBlank(line.charCodeAt(p))) p++;
        out.push(line.slice(fs, p));
      }
    }
    return out;
  }
  for (;;) {
    while (p < e && blank(line.charCodeAt(p))) p++;
    if (p < e && line.charCodeAt(p) === 34) {
      const q = closingQuote(line, p + 1, e);
      out.push(unquote(line.slice(p + 1, q)));
      p = q + 1;
      while (p < e && line.charCodeAt(p) !== delim) p++;
    } else {
      const fs = p;
      while (p < e && line.charCodeAt(p) !== delim) p++;
      let fe = p;
      while (fe > fs && blank(line.charCodeAt(fe - 1))) fe--;
      out.push(line.slice(fs, fe));
    }
    if (p >= e) break;
    p++;
  }
  return out;
}

export function isBlank(c: number): boolean {
  return c === 32 || c === 9;
}

/** Index of the quote closing a field that opened before `p` ("" is an escaped quote), or `e` if none. */
export function closingQuote(t: string, p: number, e: number): number {
  for (;;) {
    const q = t.indexOf('"', p);
    if (q < 0 || q >= e) return e;
    if (q + 1 < e && t.charCodeAt(q + 1) === 34) {
      p = q + 2;
      continue;
    }
    return q;
  }
}

function unquote(s: string): string {
  return s.includes('""') ? s.replace(/""/g, '"') : s;
}

// Whitespace-separated headers often put the unit after a space ("m_a [ueV]  g [1/GeV]"): join such tokens.
export function splitHeader(line: string, delim: number, dataColumns: number): string[] {
  const plain = splitFields(line, delim);
  if (delim !== WS || plain.length === dataColumns) return plain;
  const merged: string[] = [];
  for (const f of plain) {
    if (merged.length > 0 && /^[[(]/.test(f)) merged[merged.length - 1] += " " + f;
    else merged.push(f);
  }
  if (merged.length === dataColumns) return merged;
  const wide = line.trim().split(/\t+| {2,}/);
  return wide.length === dataColumns ? wide.map((f) => f.trim()) : merged;
}

export function countColumns(t: string, s: number, e: number, delim: number): number {
  return splitFields(t.slice(s, e), delim).length;
}

// Spreadsheets pad tables with rows such as ",,": nothing is lost by treating them as blank lines.
export function onlyDelimiters(t: string, s: number, e: number, delim: number): boolean {
  for (let i = s; i < e; i++) {
    const c = t.charCodeAt(i);
    if (c !== delim && c !== 32 && c !== 9 && c !== 34) return false;
  }
  return true;
}

/** The delimiter as a character (a space for WS). */
export function delimText(d: number): string {
  return d === WS ? " " : String.fromCharCode(d);
}
