import { useEffect, useRef } from 'react';
import { SHORTCUTS } from './shortcuts';

/** The keyboard help: every shortcut of renderer/app/shortcuts.ts. */
export function HelpOverlay({ onClose }: { onClose: () => void }) {
  const ref = useRef<HTMLButtonElement>(null);
  useEffect(() => ref.current?.focus(), []);
  return (
    <div className="overlay" role="dialog" aria-modal="true" aria-label="Keyboard shortcuts" onClick={onClose}>
      <div className="overlay-panel" onClick={(e) => e.stopPropagation()}>
        <h2>Keyboard shortcuts</h2>
        <table className="shortcuts">
          <tbody>
            {SHORTCUTS.map((s) => (
              <tr key={s.keys}>
                <td>
                  <kbd>{s.keys}</kbd>
                </td>
                <td>{s.description}</td>
              </tr>
            ))}
          </tbody>
        </table>
        <p className="muted">Plain keys act when no text field has the focus. Labels, notes and include/exclude apply to the unit shown on the Unit page (or selected in the Unit table). They sit beside the computed verdicts (never over them), carry your name and the time, are saved with the session and can be undone.</p>
        <button ref={ref} onClick={onClose}>Close (Esc)</button>
      </div>
    </div>
  );
}
