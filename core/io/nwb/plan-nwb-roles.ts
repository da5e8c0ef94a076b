/**
 * Decides which table or series of an NWB file plays which role (units,
 * trials, pulses, events), from the manifest where it says so and otherwise
 * automatically where the choice is unambiguous:
 *
 * - units: /units; without it, the file's only Units table elsewhere (e.g. in
 *   a processing module).
 * - trials: /intervals/trials when present; condition from its `condition`
 *   column when present.
 * - pulses: the file's only OptogeneticSeries (threshold crossing of the
 *   power trace). With no OptogeneticSeries, the only TimeIntervals table
 *   under /intervals whose name mentions laser, opto, light, pulse or stim
 *   (one row per pulse). More than one candidate is an error that lists them
 *   and asks the manifest to choose.
 * - events: every numeric trials column named `<label>_time` (label =
 *   the name without `_time`; one event per trial, empty cells skipped) and
 *   every other TimeIntervals table under /intervals (label = table name,
 *   time = start_time, `kind` and `trial` columns used when present), except
 *   epochs, invalid_times and the pulse table.
 *
 * `notes` says, per role, what was chosen and why (shown by `inspect`).
 * Errors (InputError naming the manifest key or the file): a path the
 * manifest names that the file does not hold, with the candidates.
 */
import { InputError } from '../../errors';
import type { NwbContents } from './list-nwb-contents';
import type { NwbEventSource, NwbManifest, NwbPulseSeries, NwbPulseTable } from './parse-nwb-manifest';

export interface NwbPlan {
  readonly units: string;
  readonly trials: { readonly table: string; readonly conditionColumn: string | null } | null;
  readonly pulses: NwbPulseTable | NwbPulseSeries | null;
  readonly events: readonly NwbEventSource[];
  readonly notes: readonly string[];
}

const PULSE_NAME = /laser|opto|light|pulse|stim/i;
const NOT_EVENTS = new Set(['/intervals/trials', '/intervals/epochs', '/intervals/invalid_times']);

export function planNwbRoles(c: NwbContents, m: NwbManifest, manifestFile = 'session.json'): NwbPlan {
  const notes: string[] = [];
  const tablePaths = c.tables.map((t) => t.path);
  const seriesPaths = c.series.map((s) => s.path);
  const needTable = (path: string, key: string) => {
    if (!tablePaths.includes(path)) {
      throw new InputError({ file: manifestFile, column: key, value: path, problem: `${c.file} has no table at this path (its tables: ${tablePaths.join(', ') || 'none'})`, fix: `run "tagbench inspect ${c.file}" and copy a path from its listing` });
    }
  };
  const needSeries = (path: string, key: string) => {
    if (!seriesPaths.includes(path)) {
      throw new InputError({ file: manifestFile, column: key, value: path, problem: `${c.file} has no time series at this path (its series: ${seriesPaths.join(', ') || 'none'})`, fix: `run "tagbench inspect ${c.file}" and copy a path from its listing` });
    }
  };

  // Units.
  let units = m.units ?? '/units';
  if (m.units) {
    needTable(units, 'nwb.units');
    notes.push(`units: ${units} (session.json)`);
  } else if (!tablePaths.includes(units)) {
    // No /units: a single Units table elsewhere (e.g. in a processing module) is unambiguous.
    const others = c.tables.filter((t) => t.neurodataType === 'Units');
    if (others.length === 1) {
      units = others[0].path;
      notes.push(`units: ${units} (the only Units table)`);
    } else if (others.length > 1) {
      throw new InputError({ file: c.file, problem: `there is no /units table but ${others.length} Units tables elsewhere (${others.map((t) => t.path).join(', ')})`, fix: `say which in session.json, e.g. "nwb": {"units": "${others[0].path}"}` });
    } else notes.push('units: none found (no Units table)');
  } else notes.push(`units: ${units}`);

  // Trials.
  let trials: NwbPlan['trials'] = null;
  if (m.trials === false) notes.push('trials: none (session.json)');
  else {
    const table = m.trials?.table ?? '/intervals/trials';
    if (m.trials?.table) needTable(table, 'nwb.trials');
    const t = c.tables.find((x) => x.path === table);
    if (t) {
      const cond = m.trials?.conditionColumn ?? (t.columns.some((col) => col.name === 'condition' && col.ragged === 0) ? 'condition' : null);
      if (m.trials?.conditionColumn && !t.columns.some((col) => col.name === cond)) {
        throw new InputError({ file: manifestFile, column: 'nwb.trials.condition_column', value: cond ?? '', problem: `the table ${table} has no such column (its columns: ${t.columns.map((x) => x.name).join(', ')})` });
      }
      trials = { table, conditionColumn: cond };
      notes.push(`trials: ${table} (${t.rows} rows)${cond ? `, condition from column "${cond}"` : ', no condition column'}`);
    } else notes.push('trials: none (no /intervals/trials)');
  }

  // Pulses.
  let pulses: NwbPlan['pulses'] = null;
  if (m.pulses === false) notes.push('pulses: none (session.json)');
  else if (m.pulses) {
    if ('table' in m.pulses) needTable(m.pulses.table, 'nwb.pulses.table');
    else needSeries(m.pulses.series, 'nwb.pulses.series');
    pulses = m.pulses;
    notes.push(`pulses: ${'table' in m.pulses ? `table ${m.pulses.table}` : `series ${m.pulses.series}, threshold crossing`} (session.json)`);
  } else {
    const opto = c.series.filter((s) => s.neurodataType === 'OptogeneticSeries');
    const named = c.tables.filter((t) => t.neurodataType === 'TimeIntervals' && t.path.startsWith('/intervals/') && !NOT_EVENTS.has(t.path) && PULSE_NAME.test(t.path.slice('/intervals/'.length)));
    if (opto.length > 1 || (opto.length === 0 && named.length > 1)) {
      const list = opto.length > 1 ? opto.map((s) => s.path) : named.map((t) => t.path);
      throw new InputError({
        file: c.file,
        problem: `the laser pulses could come from more than one ${opto.length > 1 ? 'OptogeneticSeries' : 'interval table'} (${list.join(', ')})`,
        fix: `say which in session.json, e.g. "nwb": {"pulses": {"${opto.length > 1 ? 'series' : 'table'}": "${list[0]}"}}, or "pulses": false`,
      });
    }
    if (opto.length === 1) {
      pulses = { series: opto[0].path };
      notes.push(`pulses: ${opto[0].path} (the only OptogeneticSeries), threshold crossing`);
    } else if (named.length === 1) {
      pulses = { table: named[0].path };
      notes.push(`pulses: ${named[0].path} (the only interval table named for light stimulation), one row per pulse`);
    } else notes.push('pulses: none found (no OptogeneticSeries, no interval table named for light stimulation)');
  }

  // Events.
  let events: NwbEventSource[] = [];
  if (m.events === false) notes.push('events: none (session.json)');
  else if (m.events) {
    m.events.forEach((e, i) => {
      if ('table' in e) needTable(e.table, `nwb.events[${i}].table`);
      else if ('series' in e) needSeries(e.series, `nwb.events[${i}].series`);
      else if (!trials) throw new InputError({ file: manifestFile, column: `nwb.events[${i}].trials_column`, problem: 'events from a trials column need a trials table, and this session has none' });
    });
    events = [...m.events];
    notes.push(`events: ${events.length} source(s) (session.json)`);
  } else {
    const t = trials ? c.tables.find((x) => x.path === trials!.table) : undefined;
    for (const col of t?.columns ?? []) {
      if (col.type === 'number' && col.ragged === 0 && col.cell.length === 0 && /^.+_time$/.test(col.name) && col.name !== 'start_time' && col.name !== 'stop_time') {
        events.push({ trialsColumn: col.name, label: col.name.slice(0, -'_time'.length) });
      }
    }
    const pulseTable = pulses && 'table' in pulses ? pulses.table : '';
    for (const tab of c.tables) {
      if (tab.neurodataType !== 'TimeIntervals' || !tab.path.startsWith('/intervals/') || NOT_EVENTS.has(tab.path) || tab.path === pulseTable || tab.path === trials?.table) continue;
      const has = (name: string) => tab.columns.some((x) => x.name === name && x.ragged === 0);
      events.push({
        table: tab.path,
        label: tab.path.slice('/intervals/'.length),
        ...(has('kind') ? { kindColumn: 'kind' } : {}),
        ...(has('trial') ? { trialColumn: 'trial' } : {}),
      });
    }
    notes.push(
      events.length
        ? `events: ${events.map((e) => ('trialsColumn' in e ? `trials column ${e.trialsColumn} as "${e.label}"` : 'table' in e ? `${e.table} as "${e.label}"` : e.series)).join('; ')}`
        : 'events: none found (no <label>_time trials columns, no other interval tables)',
    );
  }
  return { units, trials, pulses, events, notes };
}
