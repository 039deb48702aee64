/** Plain-English list wording shared by every sentence the engine writes. */

/** "1", "1 and 2", "1, 2 and 3". */
export function listWords(words: readonly (string | number)[]): string {
  if (words.length <= 1) return words.join('');
  return `${words.slice(0, -1).join(', ')} and ${words[words.length - 1]}`;
}
