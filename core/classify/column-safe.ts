/**
 * A label (condition, jump kind) as it appears inside a column name: letters,
 * digits and underscores only, other characters replaced by "_", "" -> "all".
 * Examples: "forward" -> "forward", "big reward" -> "big_reward".
 */
export function columnSafe(label: string): string {
  const s = label.trim().replace(/[^A-Za-z0-9_]+/g, '_');
  return s === '' ? 'all' : s;
}
