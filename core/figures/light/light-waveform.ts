import { lightFreeSpikes } from '../../light/light-free-spikes';
import { lightResponse } from '../../light/light-response';
import { lightSchedule } from '../../light/light-schedule';
import { waveformMatch } from '../../light/waveform-match';
import { formatNumber } from '../../table/format-number';
import { BASE_LAYOUT, OKABE_ITO, type FigureSpec } from '../theme';
import type { UnitFigure } from '../types';

/**
 * Light-evoked versus spontaneous mean waveform on the compared channels
 * (waveformMatch; cut from the raw recording), one panel column per channel
 * laid side by side on one time axis, with Pearson r in the title. null
 * without pulses, without raw data or when no match could be computed.
 */
export const lightWaveformFigure: UnitFigure = {
  id: 'light-waveform',
  title: 'Light response: evoked vs spontaneous waveform',
  build(ctx, unitIndex): FigureSpec | null {
    const raw = ctx.recording.raw;
    if (!raw || ctx.recording.pulses.onset.length === 0) return null;
    const p = ctx.parameters.light;
    const unit = ctx.recording.units[unitIndex];
    const sch = lightSchedule(ctx.recording.pulses, ctx.recording.span, p);
    const r = lightResponse(unit.spikeTimes, sch, p, true);
    const evoked: number[] = [];
    for (let i = 0; i < sch.n; i++) if (r.latencyS![i] === r.latencyS![i]) evoked.push(sch.onset[i] + r.latencyS![i]);
    const ch = Number(unit.meta.channel);
    const wm = waveformMatch(raw, evoked, lightFreeSpikes(unit.spikeTimes, sch.lightIntervals).spikes, p, Number.isInteger(ch) ? ch : -1);
    if (wm.channels.length === 0) return null;
    const span = wm.timeMs[wm.frames - 1] - wm.timeMs[0] + 0.5;
    const xs: (number | null)[] = [];
    const ev: (number | null)[] = [];
    const sp: (number | null)[] = [];
    wm.channels.forEach((_, k) => {
      for (let i = 0; i < wm.frames; i++) {
        xs.push(Math.round((k * span + wm.timeMs[i]) * 1000) / 1000);
        ev.push(wm.evoked[k * wm.frames + i]);
        sp.push(wm.spontaneous[k * wm.frames + i]);
      }
      xs.push(null);
      ev.push(null);
      sp.push(null);
    });
    return {
      data: [
        { type: 'scatter', mode: 'lines', name: `spontaneous (${wm.spontaneousCount} spikes)`, x: xs, y: sp, line: { color: OKABE_ITO.black } },
        { type: 'scatter', mode: 'lines', name: `light-evoked (${wm.evokedCount} spikes)`, x: xs, y: ev, line: { color: OKABE_ITO.blue, dash: 'dash' } },
      ],
      layout: {
        ...BASE_LAYOUT,
        title: { text: `Unit ${unit.id}: waveform match r = ${formatNumber(wm.r, 3)}` },
        xaxis: {
          title: { text: `channels ${wm.channels.join(', ')} (each ${formatNumber(span - 0.5, 3)} ms)` },
          tickvals: wm.channels.map((_, k) => k * span),
          ticktext: wm.channels.map((c) => `ch ${c}`),
        },
        yaxis: { title: { text: 'mean voltage (µV)' } },
      },
    };
  },
};
