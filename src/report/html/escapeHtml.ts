/**
 * Escapes text for HTML element content and quoted attribute values (&, <, >, ", '), so text
 * from a scenario such as `<script>` renders as the literal characters (OWASP XSS prevention,
 * rule 1: HTML-encode untrusted data).
 */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (character) => ENTITIES[character]!);
}

const ENTITIES: Readonly<Record<string, string>> = { "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" };
