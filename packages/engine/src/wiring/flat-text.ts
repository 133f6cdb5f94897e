/** Flat strings for texts kept in results (step texts, messages). */
let flatSink = 0;

/**
 * The string as one flat run of characters. A template literal builds a chain of fragments;
 * reading a character makes the engine flatten it in place, so a schedule of thousands of
 * texts keeps compact strings and the fragments are freed at once. (`void Number(text)` did
 * this only until the function was optimised: the unused conversion was dropped. The read
 * character goes to a module variable so it stays.)
 */
export function flatText(text: string): string {
  flatSink = text.charCodeAt(0);
  return text;
}

/** Keeps the flattening read observable; never needed by callers. */
export function flatTextSink(): number {
  return flatSink;
}
