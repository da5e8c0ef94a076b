/**
 * Escapes text for HTML element content and quoted attribute values: & < > "
 * and ' become character references. Every piece of text from the data
 * (unit ids, notes, file names, summaries) goes through this before it is
 * put into the report.
 */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ESC[c]);
}

const ESC: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };
