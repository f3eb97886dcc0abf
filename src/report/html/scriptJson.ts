/**
 * JSON for embedding inside a `<script>` element: `<`, `>` and `&` become \u003c, \u003e and
 * \u0026, so no text can close the element or open a comment, and U+2028/U+2029 are escaped too.
 * JSON.parse reads the result back unchanged.
 */
export function scriptJson(value: unknown): string {
  return JSON.stringify(value).replace(/[<>&\u2028\u2029]/g, (character) => `\\u${character.charCodeAt(0).toString(16).padStart(4, "0")}`);
}
