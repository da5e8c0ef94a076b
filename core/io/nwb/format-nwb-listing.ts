/**
 * The text `tagbench inspect <file.nwb>` prints: what the file holds (tables
 * with rows and columns, time series with size and timing, stimulus sites)
 * and which of them a run would use for units, trials, pulses and events,
 * so a user can confirm the automatic choice or write the `nwb` section of
 * session.json. Plain text, one item per line, paths as the manifest takes
 * them.
 */
import type { NwbContents } from './list-nwb-contents';
import type { NwbPlan } from './plan-nwb-roles';

export function formatNwbListing(c: NwbContents, plan: NwbPlan | null, planError?: string): string {
  const lines: string[] = [];
  lines.push(`${c.file}: NWB ${c.nwbVersion}${c.identifier ? `, identifier "${c.identifier}"` : ''}`);
  if (c.sessionDescription) lines.push(`  session: ${c.sessionDescription}`);
  if (c.sessionStartTime) lines.push(`  started: ${c.sessionStartTime}`);
  lines.push('', `Tables (${c.tables.length}):`);
  for (const t of c.tables) {
    lines.push(`  ${t.path}  [${t.neurodataType || 'table'}, ${t.rows} row${t.rows === 1 ? '' : 's'}]${t.description ? `  ${t.description}` : ''}`);
    for (const col of t.columns) {
      const cell = col.cell.length ? ` x [${col.cell.join(' x ')}]` : '';
      const ragged = col.ragged === 1 ? ', ragged' : col.ragged > 1 ? `, ragged x${col.ragged}` : '';
      lines.push(`      ${col.name}: ${col.type}${cell}${ragged}`);
    }
  }
  lines.push('', `Time series (${c.series.length}):`);
  for (const s of c.series) {
    const timing = s.timing === 'rate' ? `${fmt(s.rateHz)} Hz from ${fmt(s.startS)} s` : `timestamps ${fmt(s.startS)}..${fmt(s.stopS)} s`;
    lines.push(`  ${s.path}  [${s.neurodataType || 'TimeSeries'}, ${s.shape.join(' x ')} samples${s.unit ? `, ${s.unit}` : ''}, ${timing}]${s.description ? `  ${s.description}` : ''}`);
  }
  if (c.sites.length) {
    lines.push('', 'Optogenetic stimulus sites:');
    for (const s of c.sites) {
      const lambda = Number.isFinite(s.excitationLambdaNm) ? `, ${fmt(s.excitationLambdaNm)} nm` : '';
      lines.push(`  ${s.path}: ${s.description || '(no description)'}${s.location ? `; ${s.location}` : ''}${lambda}`);
    }
  }
  lines.push('', 'A run would use:');
  if (plan) for (const n of plan.notes) lines.push(`  ${n}`);
  else lines.push(`  (no automatic choice: ${planError ?? 'see the message above'})`);
  lines.push('', 'To choose differently, add an "nwb" section to session.json (see "NWB files" in the README).');
  return lines.join('\n') + '\n';
}

function fmt(x: number): string {
  return Number.isFinite(x) ? String(Math.round(x * 1e6) / 1e6) : '?';
}
