/**
 * A limit on how deep a JSON body may nest, checked on the raw text before it is parsed: every
 * later step (validation, checksums, the copy to a compute thread, the answer) walks the value
 * recursively, and a body of 100 000 nested brackets overflows the stack of any of them. No drydig
 * document nests deeper than about ten levels.
 */

/** Deepest nesting of arrays and objects a request body may have. */
export const MAX_JSON_DEPTH = 64;

/** The deepest nesting of `[` / `{` in JSON text (brackets inside strings do not count); stops counting past `limit`. */
export function jsonNestingDepth(text: string, limit = Infinity): number {
  let depth = 0;
  let deepest = 0;
  let inString = false;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (inString) {
      if (c === 0x5c) i++; // backslash: skip the escaped character
      else if (c === 0x22) inString = false;
    } else if (c === 0x22) inString = true;
    else if (c === 0x5b || c === 0x7b) {
      depth++;
      if (depth > deepest) {
        deepest = depth;
        if (deepest > limit) return deepest;
      }
    } else if (c === 0x5d || c === 0x7d) depth--;
  }
  return deepest;
}
