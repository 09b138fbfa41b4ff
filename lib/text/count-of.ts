/** "1 board", "3 boards", "0 boards": a number with the word that goes with it in English. */
export function countOf(n: number, one: string, many: string): string {
  return `${n} ${n === 1 ? one : many}`;
}
