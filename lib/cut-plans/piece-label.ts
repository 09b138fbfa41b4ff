/**
 * Fits a piece's label inside its rectangle in a cut diagram (issue 15: labels spilled out of short
 * pieces). Tries the full label, then the size alone, then the name cut short with an ellipsis; null
 * when not even that fits at a readable size (the piece's tooltip still carries the full label).
 * Lengths are in the diagram's own units (its viewBox).
 */

// Source: IBM Plex Mono, the diagram's face: every glyph advances 600 units of a 1000-unit em.
export const MONO_ADVANCE = 0.6;
/**
 * The height a line of text takes, in ems: the face's ascent plus descent. From memory: IBM Plex Mono
 * has an ascender of 1025 and a descender of 275 units per 1000-unit em. A font size equal to the
 * piece's height (the first version) spilled out of the thin strips of a ripped board.
 */
export const LINE_BOX = 1.3;
/** Room kept between the text and the piece's edges, each side. */
const PAD = 4;

export type PieceLabel = { text: string; fontSize: number };

export function fitPieceLabel(name: string, size: string, box: { width: number; height: number }, maxFont: number, minFont: number): PieceLabel | null {
  const width = box.width - 2 * PAD;
  const tallest = (box.height - 2 * PAD) / LINE_BOX;
  if (width <= 0 || tallest < minFont) return null;
  const fontFor = (text: string) => Math.min(maxFont, tallest, width / (Math.max(text.length, 1) * MONO_ADVANCE));
  for (const text of [`${name} ${size}`, size]) {
    const fontSize = fontFor(text);
    if (fontSize >= minFont) return { text, fontSize };
  }
  // As many characters of the name as fit at the smallest readable size, the last one an ellipsis.
  const chars = Math.floor(width / (minFont * MONO_ADVANCE));
  if (chars < 3) return null;
  const text = name.length <= chars ? name : `${name.slice(0, chars - 1).trimEnd()}…`;
  return { text, fontSize: fontFor(text) };
}

/** The width the text takes at its size, for the check that it stays inside. */
export const labelWidth = (label: PieceLabel) => label.text.length * MONO_ADVANCE * label.fontSize;

/** The height the text's line takes at its size. */
export const labelHeight = (label: PieceLabel) => label.fontSize * LINE_BOX;
