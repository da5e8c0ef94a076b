/**
 * JSON text safe inside <script type="application/json">: "<", ">", "&" and
 * the line separators U+2028/U+2029 are written as \u escapes, so no data
 * (a note containing "</script>", say) can end the element. JSON.parse of
 * the element's text gives the value back. Non-finite numbers become null.
 */
export function embedJson(value: unknown): string {
  return JSON.stringify(value, (_k, v) => (typeof v === 'number' && !Number.isFinite(v) ? null : v))
    .replace(/</g, '\\u003c')
    .replace(/>/g, '\\u003e')
    .replace(/&/g, '\\u0026')
    .replace(/\u2028/g, '\\u2028')
    .replace(/\u2029/g, '\\u2029');
}
