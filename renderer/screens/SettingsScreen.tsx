import { useEffect, useMemo, useState } from 'react';
import defaultsSource from '../../core/defaults.ts?raw';
import { DEFAULTS } from '../../core/defaults';
import { CURATOR_KEY, curatorName, type OpenSession, type Overrides } from '../app/App';
import { writeLocal } from '../host/browser-host';
import { parseParameterDocs, unitOfKey } from '../settings/parameter-docs';
import { PARAMETER_HELP } from '../settings/parameter-help';

const DOCS = parseParameterDocs(defaultsSource);
type Draft = Record<string, Record<string, string>>;

const show = (v: unknown): string => (v === null ? '' : typeof v === 'object' ? JSON.stringify(v) : String(v));

function toDraft(params: Record<string, Record<string, unknown>>): Draft {
  const out: Draft = {};
  for (const [s, values] of Object.entries(params)) {
    out[s] = {};
    for (const [k, v] of Object.entries(values)) out[s][k] = show(v);
  }
  return out;
}

/** Draft text back to overrides: only values that differ from DEFAULTS; a value that does not parse is an error naming the parameter. */
export function draftToOverrides(draft: Draft): { overrides: Overrides; error: string | null } {
  const overrides: Overrides = {};
  for (const [section, values] of Object.entries(DEFAULTS as unknown as Record<string, Record<string, unknown>>)) {
    for (const [key, def] of Object.entries(values)) {
      const text = (draft[section]?.[key] ?? show(def)).trim();
      let value: unknown;
      if (def === null) value = text === '' ? null : Number(text);
      else if (typeof def === 'number') value = text === '' ? NaN : Number(text);
      else if (typeof def === 'boolean') value = text === 'true';
      else if (typeof def === 'object') {
        try {
          value = JSON.parse(text);
        } catch {
          return { overrides: {}, error: `${section}.${key}: "${text}" is not a valid list.` };
        }
      } else value = text;
      if ((typeof def === 'number' || def === null) && value !== null && !Number.isFinite(value as number)) {
        return { overrides: {}, error: `${section}.${key}: "${text}" is not a number.` };
      }
      if (JSON.stringify(value) !== JSON.stringify(def)) (overrides[section] ??= {})[key] = value;
    }
  }
  return { overrides, error: null };
}

/** Analysis settings: every parameter with its default, unit and explanation; re-run with progress; saved with the session. */
export function SettingsScreen({ session, onRun, error, busy, onStatus }: { session: OpenSession; onRun: (o: Overrides) => void; error: string | null; busy: boolean; onStatus: (s: string) => void }) {
  const [curator, setCurator] = useState(curatorName);
  const current = session.analysis.parameters as unknown as Record<string, Record<string, unknown>>;
  const [draft, setDraft] = useState<Draft>(() => toDraft(current));
  useEffect(() => setDraft(toDraft(current)), [current]);
  const parsed = useMemo(() => draftToOverrides(draft), [draft]);
  const changedFromRun = JSON.stringify(parsed.overrides) !== JSON.stringify(session.overrides);

  return (
    <div className="screen settings">
      <div className="toolbar">
        <h1>Analysis settings</h1>
        <button className="primary" disabled={busy || !!parsed.error || !changedFromRun} onClick={() => onRun(parsed.overrides)} data-testid="rerun">
          Apply and re-run
        </button>
        <button disabled={busy} onClick={() => setDraft(toDraft(DEFAULTS as unknown as Record<string, Record<string, unknown>>))}>Reset all to defaults</button>
        <span className="muted small">Settings are saved with the session; changed values are marked.</span>
        <label className="control curator">
          Your name on curation decisions
          <input
            value={curator}
            onChange={(e) => setCurator(e.target.value)}
            onBlur={() => {
              writeLocal(CURATOR_KEY, curator.trim());
              onStatus(`Curation decisions will be signed "${curatorName()}".`);
            }}
            spellCheck={false}
            aria-label="Your name on curation decisions"
          />
        </label>
      </div>
      {(parsed.error || error) && <p className="error-message" role="alert">{parsed.error ?? error}</p>}
      <div className="settings-sections">
        {Object.entries(DEFAULTS as unknown as Record<string, Record<string, unknown>>).map(([section, values]) => (
          <section className="panel" key={section}>
            <h2>{section}</h2>
            {DOCS.get(`${section}.`)?.text && <p className="muted small">{DOCS.get(`${section}.`)!.text}</p>}
            <table className="params">
              <tbody>
                {Object.entries(values).map(([key, def]) => {
                  const text = draft[section]?.[key] ?? show(def);
                  const changed = text.trim() !== show(def);
                  const doc = DOCS.get(`${section}.${key}`)?.text || PARAMETER_HELP[`${section}.${key}`] || '';
                  const id = `p-${section}-${key}`;
                  return (
                    <tr key={key} className={changed ? 'changed' : ''}>
                      <th><label htmlFor={id}>{key}</label></th>
                      <td className="param-input">
                        {typeof def === 'boolean' ? (
                          <input id={id} type="checkbox" checked={text === 'true'} onChange={(e) => setDraft({ ...draft, [section]: { ...draft[section], [key]: String(e.target.checked) } })} />
                        ) : (
                          <input
                            id={id}
                            value={text}
                            inputMode={typeof def === 'number' || def === null ? 'decimal' : undefined}
                            placeholder={def === null ? 'auto' : ''}
                            onChange={(e) => setDraft({ ...draft, [section]: { ...draft[section], [key]: e.target.value } })}
                            spellCheck={false}
                          />
                        )}
                        <span className="unit">{unitOfKey(key)}</span>
                      </td>
                      <td className="muted small default">default {def === null ? 'auto' : show(def)}</td>
                      <td className="doc">{doc}</td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          </section>
        ))}
      </div>
    </div>
  );
}
