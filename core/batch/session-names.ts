/**
 * Unique, file-system-safe names for a batch's sessions, from their paths:
 * the last path component (an ".nwb" extension dropped), characters other
 * than letters, digits, ".", "_" and "-" replaced by "_", and repeats
 * numbered in list order ("a", "a-2", "a-3"). The same list always gives the
 * same names, which is what lets a re-run find its earlier results. Both "/"
 * and "\" separate path components; trailing separators are ignored.
 */
export function sessionNames(paths: readonly string[]): string[] {
  const used = new Map<string, number>();
  const taken = new Set<string>();
  return paths.map((p) => {
    const parts = p.replace(/[\\/]+$/, '').split(/[\\/]/);
    let base = parts[parts.length - 1] || 'session';
    base = base.replace(/\.nwb$/i, '').replace(/[^A-Za-z0-9._-]/g, '_');
    if (base === '' || base === '.' || base === '..') base = 'session';
    let name = base;
    let k = used.get(base) ?? 1;
    while (taken.has(name)) {
      k++;
      name = `${base}-${k}`;
    }
    used.set(base, k);
    taken.add(name);
    return name;
  });
}
