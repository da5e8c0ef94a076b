import type { OpenSession } from '../app/App';
import { Plot } from '../components/Plot';
import { formatNumber } from '../../core/table/format-number';

const fmt = (x: number, d = 4) => (Number.isFinite(x) ? formatNumber(x, d) : '-');

/** Session overview: what was imported, warnings, and a timeline of the recording. */
export function OverviewScreen({ session }: { session: OpenSession }) {
  const s = session.info.summary;
  const warnings = [...session.info.importWarnings, ...session.analysis.warnings];
  const duration = s.spanS[1] - s.spanS[0];
  return (
    <div className="screen overview">
      <h1>
        Session overview <span className="muted">· {session.opened.name}</span>
      </h1>
      <div className="facts">
        <Fact label="Units" value={String(s.units)} />
        <Fact label="Spikes" value={s.spikes.toLocaleString('en')} />
        <Fact label="Recording span" value={`${fmt(s.spanS[0])} - ${fmt(s.spanS[1])} s`} note={`${fmt(duration / 60, 3)} min; from the ${s.spanSource}`} />
        <Fact label="Laser pulses" value={String(s.pulses)} note={s.pulses ? `${fmt(s.lightBlockS[0])} - ${fmt(s.lightBlockS[1])} s` : 'no light block'} />
        <Fact label="Waveforms" value={s.hasWaveforms ? 'yes' : 'no'} note={s.hasRaw ? 'raw voltage file present' : undefined} />
      </div>
      <div className="columns">
        <section className="panel">
          <h2>Light stimulation</h2>
          {s.pulses === 0 ? (
            <p className="muted">No pulses: light identification does not apply to this session.</p>
          ) : (
            <table className="plain">
              <thead>
                <tr><th>Pulses</th><th className="num">Count</th><th className="num">Trains</th></tr>
              </thead>
              <tbody>
                <tr><td>single pulses</td><td className="num">{s.singlePulses}</td><td className="num">-</td></tr>
                {s.trainsByFrequency.map((t) => (
                  <tr key={String(t.frequencyHz)}>
                    <td>{Number.isNaN(t.frequencyHz) ? 'trains, frequency not given' : `trains at ${fmt(t.frequencyHz)} Hz`}</td>
                    <td className="num">{t.pulses}</td>
                    <td className="num">{t.trains}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          )}
        </section>
        <section className="panel">
          <h2>Events</h2>
          {s.eventsByLabel.length === 0 ? (
            <p className="muted">No task events.</p>
          ) : (
            <table className="plain">
              <thead><tr><th>Label</th><th className="num">Count</th><th>Kinds</th></tr></thead>
              <tbody>
                {s.eventsByLabel.map((e) => (
                  <tr key={e.label}><td>{e.label}</td><td className="num">{e.count}</td><td>{e.kinds.join(', ') || '-'}</td></tr>
                ))}
              </tbody>
            </table>
          )}
        </section>
        <section className="panel">
          <h2>Trials</h2>
          {s.trialsByCondition.length === 0 ? (
            <p className="muted">No trial table.</p>
          ) : (
            <table className="plain">
              <thead><tr><th>Condition</th><th className="num">Trials</th></tr></thead>
              <tbody>
                {s.trialsByCondition.map((t) => (
                  <tr key={t.condition}><td>{t.condition}</td><td className="num">{t.count}</td></tr>
                ))}
              </tbody>
            </table>
          )}
        </section>
        <section className="panel">
          <h2>Warnings</h2>
          {warnings.length === 0 ? (
            <p className="muted">None.</p>
          ) : (
            <ul className="warnings">
              {warnings.map((w, i) => (
                <li key={i}>
                  {w.message} {w.count > 1 && <span className="muted">({w.count} times)</span>} {w.file && <span className="muted">· {w.file}</span>}
                </li>
              ))}
            </ul>
          )}
        </section>
      </div>
      <section className="panel wide">
        <Plot spec={session.info.timeline} testId="timeline-plot" />
      </section>
    </div>
  );
}

function Fact({ label, value, note }: { label: string; value: string; note?: string }) {
  return (
    <div className="fact">
      <div className="fact-label">{label}</div>
      <div className="fact-value">{value}</div>
      {note && <div className="fact-note">{note}</div>}
    </div>
  );
}
