/** Escapes text for SVG/XML element content and double-quoted attribute values (&, <, >, "). */
export function escapeXml(text: string): string {
  return text.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;");
}
