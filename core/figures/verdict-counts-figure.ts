import type { UnitTable } from '../table/types';
import { BASE_LAYOUT, VERDICT_STYLE, type FigureSpec } from './theme';

/** Verdict words by column family (DESIGN.md section 3). */
const FAMILIES: readonly { match: (name: string) => boolean; words: readonly string[] }[] = [
  { match: (n) => n === 'tag', words: ['tagged', 'borderline', 'untagged'] },
  { match: (n) => n === 'ramp', words: ['up', 'down', 'flat'] },
  // jump_K is the only text column of its triple (jump_K_delta_hz and jump_K_p are numbers).
  { match: (n) => n.startsWith('jump_'), words: ['excited', 'suppressed', 'none'] },
];

/** Counts of each verdict word in each verdict column of a unit table (columns in table order). */
export function verdictCounts(table: UnitTable): { column: string; counts: { word: string; n: number }[] }[] {
  const out: { column: string; counts: { word: string; n: number }[] }[] = [];
  for (const c of table.columns) {
    if (c.kind !== 'string') continue;
    const fam = FAMILIES.find((f) => f.match(c.name));
    if (!fam) continue;
    const counts = fam.words.map((word) => ({ word, n: 0 }));
    for (const v of c.values) {
      const e = counts.find((x) => x.word === v);
      if (e) e.n++;
    }
    out.push({ column: c.name, counts });
  }
  return out;
}

/**
 * Bar chart of verdict counts: one group of bars per verdict column, each
 * verdict in its theme colour with its word on the bar (never colour alone).
 * Null when the table has no verdict column yet.
 */
export function verdictCountsFigure(table: UnitTable): FigureSpec | null {
  const vc = verdictCounts(table);
  if (vc.length === 0) return null;
  const data: Record<string, unknown>[] = [];
  for (const { column, counts } of vc) {
    for (const { word, n } of counts) {
      const style = VERDICT_STYLE[word] ?? { color: '#7f7f7f' };
      data.push({
        type: 'bar',
        orientation: 'h',
        x: [n],
        y: [column],
        name: word,
        text: [`${word} ${n}`],
        textposition: 'inside',
        insidetextanchor: 'middle',
        marker: { color: style.color, line: { color: '#333', width: 0.5 } },
        showlegend: false,
        hovertemplate: `${column}: ${word} = %{x}<extra></extra>`,
      });
    }
  }
  return {
    data,
    layout: {
      ...BASE_LAYOUT,
      title: { text: 'Units per verdict', font: { size: 13 } },
      barmode: 'stack',
      height: 90 + 44 * vc.length,
      xaxis: { title: { text: 'Units (count)' }, rangemode: 'tozero' },
      yaxis: { autorange: 'reversed', automargin: true },
      showlegend: false,
    },
  };
}
