import { verdictColumns } from '../../curation/verdict-columns';
import { verdictWords } from '../../curation/verdict-words';
import { BASE_LAYOUT, OKABE_ITO } from '../theme';
import type { PopulationFigure } from '../types';

/**
 * Units per verdict word, for every verdict column of the table (tag, ramp,
 * quality, jump_K): computed counts, and final counts beside them when the
 * table carries curation (final_V columns). Every word of a column is shown,
 * including those with zero units.
 */
export const verdictCountsFigure: PopulationFigure = {
  id: 'verdict-counts',
  title: 'Units per verdict',
  build({ table }) {
    const cols = verdictColumns(table);
    if (cols.length === 0) return null;
    const byName = new Map(table.columns.map((c) => [c.name, c]));
    const xs: [string[], string[]] = [[], []];
    const computed: number[] = [];
    const final: number[] = [];
    let anyFinal = false;
    for (const c of cols) {
      const f = byName.get(`final_${c.name}`);
      if (f) anyFinal = true;
      for (const w of verdictWords(c.name)!) {
        xs[0].push(c.name);
        xs[1].push(w);
        computed.push((c.values as readonly string[]).filter((v) => v === w).length);
        final.push(f ? (f.values as readonly string[]).filter((v) => v === w).length : NaN);
      }
    }
    // Count labels above the bars are never clipped (cliponaxis false, 15 %
    // headroom on y); the two-level category labels (word, then column) get
    // the room they need below the axis (automargin); the legend sits above.
    const top = Math.max(1, ...computed, ...final.filter((v) => !Number.isNaN(v)));
    const data: Record<string, unknown>[] = [
      { type: 'bar', x: xs, y: computed, name: 'computed', marker: { color: OKABE_ITO.blue }, text: computed.map(String), textposition: 'outside', cliponaxis: false },
    ];
    if (anyFinal) {
      data.push({ type: 'bar', x: xs, y: final.map((v) => (Number.isNaN(v) ? null : v)), name: 'final (after curation)', marker: { color: OKABE_ITO.orange, pattern: { shape: '/' } }, text: final.map((v) => (Number.isNaN(v) ? '' : String(v))), textposition: 'outside', cliponaxis: false });
    }
    return {
      data,
      layout: {
        ...BASE_LAYOUT,
        height: 380,
        margin: { l: 60, r: 16, t: 72, b: 24 },
        title: { text: `Units per verdict (${table.rowCount} units)`, y: 0.98, yanchor: 'top' },
        legend: { orientation: 'h', x: 0, xanchor: 'left', y: 1.02, yanchor: 'bottom' },
        barmode: 'group',
        xaxis: { type: 'multicategory', automargin: true, tickfont: { size: 11 } },
        yaxis: { title: { text: 'Units' }, range: [0, top * 1.15], automargin: true },
      },
    };
  },
};
