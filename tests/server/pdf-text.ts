/**
 * Reads the text of a PDF that pdfkit wrote with `compress: false`: its standard fonts draw text as hex strings
 * in TJ arrays (PDF 1.7, ISO 32000-1 §9.4.3), one content stream per page. Good enough for our own PDFs only.
 */
const PAGE = /\/Type \/Page\b(?!s)/g;

export const pdfPageCount = (pdf: Buffer): number => pdf.toString('latin1').match(PAGE)?.length ?? 0;

/** WinAnsi bytes pdfkit uses for the few non-ASCII characters our sheets print. */
const WIN_ANSI: Record<number, string> = { 0x96: '–', 0x97: '—', 0x92: '’', 0xb7: '·' };

function decodeHex(hex: string): string {
  let out = '';
  for (let i = 0; i < hex.length; i += 2) {
    const byte = parseInt(hex.slice(i, i + 2), 16);
    out += WIN_ANSI[byte] ?? String.fromCharCode(byte);
  }
  return out;
}

/** The text of each page's content stream, one line per text object, in the order the pages appear. */
export function pdfText(pdf: Buffer): string[] {
  const raw = pdf.toString('latin1');
  const streams = [...raw.matchAll(/stream\n([\s\S]*?)\nendstream/g)].map((m) => m[1]!);
  return streams
    .filter((s) => /\bTJ\b/.test(s))
    .map((s) =>
      [...s.matchAll(/\[([^\]]*)\] TJ/g)]
        .map((m) => [...m[1]!.matchAll(/<([0-9a-fA-F]*)>/g)].map((h) => decodeHex(h[1]!)).join(''))
        .join('\n'),
    );
}
