/** Plain-English list wording shared by every sentence the engine writes. */

/** "1", "1 and 2", "1, 2 and 3". */
export function listWords(words: readonly (string | number)[]): string {
  if (words.length <= 1) return words.join('');
  return `${words.slice(0, -1).join(', ')} and ${words[words.length - 1]}`;
}

const SUPERSCRIPT = '⁰¹²³⁴⁵⁶⁷⁸⁹';

/**
 * A count in words a reader can take in: grouped digits up to a billion ("4,000,000"), past it the leading
 * figures and a power of ten ("about 2.5 × 10⁴⁸"), where a row of fifty digits would say nothing more.
 */
export function countWords(n: number): string {
  if (!Number.isFinite(n)) return 'more than can be counted';
  if (Math.abs(n) < 1e9) return Math.round(n).toLocaleString('en');
  const [mantissa, exponent] = n.toExponential(1).split('e');
  const power = [...String(Number(exponent))].map((d) => SUPERSCRIPT[Number(d)]).join('');
  return `about ${mantissa} × 10${power}`;
}
