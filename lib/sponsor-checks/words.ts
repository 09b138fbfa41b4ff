// Case- and punctuation-insensitive words: letters and digits only, lower-cased, accents kept apart
// by Unicode normalisation so "Café" and "cafe\u0301" compare equal. "Don't" is the two words
// "don" and "t" on both sides of the comparison, so phrases still match whole words.
const TOKEN = /[\p{L}\p{N}]+/gu;

export function tokenize(text: string): string[] {
  const out: string[] = [];
  for (const m of text.normalize('NFC').toLocaleLowerCase('en').matchAll(TOKEN)) out.push(m[0]);
  return out;
}

/** Index of the first word where `needle` occurs as whole consecutive words in `haystack`, or -1. */
export function findPhrase(haystack: readonly string[], needle: readonly string[]): number {
  if (needle.length === 0 || needle.length > haystack.length) return -1;
  outer: for (let i = 0; i + needle.length <= haystack.length; i++) {
    for (let j = 0; j < needle.length; j++) if (haystack[i + j] !== needle[j]) continue outer;
    return i;
  }
  return -1;
}
