// Role choice rules are ours (README "NWB files"); table and series types are
// the NWB 2.x schema's (TimeIntervals: nwb.epoch.yaml; OptogeneticSeries:
// nwb.ogen.yaml).
import { describe, expect, it } from 'vitest';
import type { NwbContents, NwbSeriesListing, NwbTableListing } from '../../../../core/io/nwb/list-nwb-contents';
import { planNwbRoles } from '../../../../core/io/nwb/plan-nwb-roles';

const col = (name: string, type = 'number') => ({ name, type, cell: [], ragged: 0 });
const table = (path: string, cols: string[], type = 'TimeIntervals'): NwbTableListing => ({ path, neurodataType: type, description: '', rows: 3, columns: cols.map((c) => col(c, c === 'condition' || c === 'kind' ? 'text' : 'number')) });
const opto = (path: string): NwbSeriesListing => ({ path, neurodataType: 'OptogeneticSeries', description: '', shape: [10], unit: 'watts', timing: 'rate', rateHz: 1000, startS: 0, stopS: 0.009 });
const contents = (tables: NwbTableListing[], series: NwbSeriesListing[] = []): NwbContents => ({
  file: 'f.nwb', nwbVersion: '2.7.0', identifier: '', sessionDescription: '', sessionStartTime: '', tables, series, sites: [],
});
const units = table('/units', ['spike_times'], 'Units');

describe('planNwbRoles', () => {
  it('chooses trials, the only OptogeneticSeries, <label>_time columns and other interval tables automatically', () => {
    const c = contents(
      [units, table('/intervals/trials', ['start_time', 'stop_time', 'condition', 'reward_time', 'cue_time']), table('/intervals/jump', ['start_time', 'stop_time', 'kind']), table('/intervals/epochs', ['start_time', 'stop_time'])],
      [opto('/stimulus/presentation/laser')],
    );
    const p = planNwbRoles(c, {});
    expect(p.units).toBe('/units');
    expect(p.trials).toEqual({ table: '/intervals/trials', conditionColumn: 'condition' });
    expect(p.pulses).toEqual({ series: '/stimulus/presentation/laser' });
    expect(p.events).toEqual([
      { trialsColumn: 'reward_time', label: 'reward' },
      { trialsColumn: 'cue_time', label: 'cue' },
      { table: '/intervals/jump', label: 'jump', kindColumn: 'kind' },
    ]);
  });
  it('takes the only interval table named for light as pulses and keeps it out of the events', () => {
    const p = planNwbRoles(contents([units, table('/intervals/laser_pulses', ['start_time', 'stop_time']), table('/intervals/reward', ['start_time', 'stop_time'])]), {});
    expect(p.pulses).toEqual({ table: '/intervals/laser_pulses' });
    expect(p.events).toEqual([{ table: '/intervals/reward', label: 'reward' }]);
    expect(p.trials).toBeNull();
  });
  it('without /units, takes the only Units table elsewhere; two are an error', () => {
    const moved = table('/processing/ecephys/sorted', ['spike_times'], 'Units');
    expect(planNwbRoles(contents([moved]), {}).units).toBe('/processing/ecephys/sorted');
    expect(() => planNwbRoles(contents([moved, table('/processing/b', ['spike_times'], 'Units')]), {})).toThrow(/no \/units table but 2 Units tables/);
  });
  it('refuses to guess between two OptogeneticSeries and says how to choose', () => {
    expect(() => planNwbRoles(contents([units], [opto('/a'), opto('/b')]), {})).toThrow(/more than one OptogeneticSeries \(\/a, \/b\).*"pulses": \{"series": "\/a"\}/);
  });
  it('follows the manifest, and names the manifest key when a path is missing', () => {
    const c = contents([units, table('/intervals/trials', ['start_time', 'stop_time', 'reward_time'])], [opto('/a'), opto('/b')]);
    const p = planNwbRoles(c, { pulses: { series: '/b' }, events: [{ trialsColumn: 'reward_time', label: 'water' }], trials: { table: '/intervals/trials' } });
    expect(p.pulses).toEqual({ series: '/b' });
    expect(p.events).toEqual([{ trialsColumn: 'reward_time', label: 'water' }]);
    expect(p.trials).toEqual({ table: '/intervals/trials', conditionColumn: null });
    expect(() => planNwbRoles(c, { pulses: { table: '/intervals/nope' } })).toThrow(/session\.json, column "nwb\.pulses\.table": f\.nwb has no table at this path/);
    expect(() => planNwbRoles(c, { pulses: false, trials: false, events: [{ trialsColumn: 'reward_time' }] })).toThrow(/need a trials table/);
  });
});
