/**
 * Makes JavaScript or JSON text safe inside an inline <script> element: the
 * sequences "</script" (any case) and "<!--" would end or confuse the script
 * element, so "<" is escaped there ("<\/script", "<\!--"). Inside JS strings
 * and JSON strings these escapes read back as the same characters; for JSON
 * data use embedJson, which escapes every "<" as \u003c.
 */
export function embedScript(js: string): string {
  return js.replace(/<\/(script)/gi, '<\\/$1').replace(/<!--/g, '<\\!--');
}
