import { useEffect, useState } from 'react';
import type { OpenSession } from '../app/App';
import { Plot } from '../components/Plot';
import { VerdictBadge } from '../components/VerdictBadge';
import type { CurationState } from '../../core/curation/types';
import type { PopulationView } from '../worker/api';
import type { AnalysisClient } from '../worker/client';

/** Population: verdict counts and population figures over the units not excluded by curation. */
export function PopulationScreen({ client, session, curation }: { client: AnalysisClient; session: OpenSession; curation: CurationState }) {
  const [view, setView] = useState<PopulationView | null>(null);
  const [error, setError] = useState<string | null>(null);
  const excluded = Object.entries(curation.units).filter(([, c]) => c.include?.value === false).map(([id]) => id);
  useEffect(() => {
    let live = true;
    client.population(curation).then(
      (v) => live && setView(v),
      (e: Error) => live && setError(e.message),
    );
    return () => {
      live = false;
    };
  }, [client, session.analysis, curation]);
  if (error) return <div className="screen"><p className="error-message">{error}</p></div>;
  if (!view) return <div className="screen"><p className="muted">Summarising...</p></div>;
  return (
    <div className="screen population">
      <h1>
        Population <span className="muted">· {view.units} units{excluded.length ? `, ${excluded.length} excluded by curation` : ''}</span>
      </h1>
      {view.counts.length === 0 ? (
        <p className="muted">This analysis gives no verdicts yet.</p>
      ) : (
        <div className="columns">
          {view.counts.map((c) => (
            <section className="panel" key={c.column}>
              <h2>{c.column}</h2>
              <table className="plain">
                <thead>
                  <tr><th /><th className="num">computed</th><th className="num">after your labels</th></tr>
                </thead>
                <tbody>
                  {c.counts.map((x) => (
                    <tr key={x.word}>
                      <td><VerdictBadge word={x.word} /></td>
                      <td className="num">{x.computed}</td>
                      <td className="num">{x.final}{view.units ? <span className="muted"> ({Math.round((100 * x.final) / view.units)} %)</span> : null}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </section>
          ))}
        </div>
      )}
      {view.figures.map((f) => (
        <section className="panel wide" key={f.id}>
          <Plot spec={f.spec} testId={`plot-${f.id}`} />
        </section>
      ))}
      <p className="muted small">Verdicts are statistical screens, not proof of identity; counts inherit every assumption of the rules in Analysis settings.</p>
    </div>
  );
}
