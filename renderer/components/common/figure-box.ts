/**
 * The width of an inline `.figure-box` (see base.css): one `ch` per character, which holds tabular digits exactly
 * and the narrower decimal point with room to spare. The width changes only when the text's length does, so a new
 * figure of the same length re-lays out its box alone.
 */
export function boxWidth(text: string): { width: string } {
  return { width: `${text.length}ch` };
}
