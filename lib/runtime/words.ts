// A word is a run of letters or digits; apostrophes and hyphens inside it keep it one word
// ("don't", "half-lap"), and "2x4" is one word. Punctuation alone is no word.
const WORD = /[\p{L}\p{N}]+(?:['’\-‐][\p{L}\p{N}]+)*/gu;

export function countWords(text: string): number {
  let n = 0;
  for (const _ of text.matchAll(WORD)) n++;
  return n;
}
