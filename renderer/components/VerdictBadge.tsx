import { VERDICT_STYLE } from '../../core/figures/theme';

/** Small SVG of a Plotly marker symbol name, so table badges match the figures' markers. */
function Shape({ symbol, color }: { symbol: string; color: string }) {
  const common = { stroke: color, strokeWidth: 1.6 };
  switch (symbol) {
    case 'circle':
      return <circle cx="6" cy="6" r="4.5" fill={color} {...common} />;
    case 'circle-open':
      return <circle cx="6" cy="6" r="4" fill="none" {...common} />;
    case 'diamond':
      return <path d="M6 1 L11 6 L6 11 L1 6 Z" fill={color} {...common} />;
    case 'triangle-up':
      return <path d="M6 1.5 L11 10.5 L1 10.5 Z" fill={color} {...common} />;
    case 'triangle-down':
      return <path d="M1 1.5 L11 1.5 L6 10.5 Z" fill={color} {...common} />;
    default:
      return <path d="M1.5 6 L10.5 6" fill="none" {...common} strokeWidth={2} />;
  }
}

/** A verdict as text with its colour and marker shape (never colour alone). */
export function VerdictBadge({ word }: { word: string }) {
  if (!word) return <span className="verdict verdict-empty">-</span>;
  const style = VERDICT_STYLE[word];
  if (!style) return <span className="verdict">{word}</span>;
  return (
    <span className="verdict" data-verdict={word}>
      <svg width="12" height="12" viewBox="0 0 12 12" aria-hidden="true">
        <Shape symbol={style.symbol} color={style.color} />
      </svg>
      <span style={{ color: darken(style.color) }}>{word}</span>
    </span>
  );
}

/** Verdict text colour: the palette colour, darkened enough to read as text on white. */
function darken(hex: string): string {
  const n = parseInt(hex.slice(1), 16);
  const f = 0.72;
  const r = Math.round(((n >> 16) & 255) * f);
  const g = Math.round(((n >> 8) & 255) * f);
  const b = Math.round((n & 255) * f);
  return `rgb(${r}, ${g}, ${b})`;
}

/** True for the words of the verdict columns (tag, ramp, jump_K). */
export function isVerdictWord(word: string): boolean {
  return word in VERDICT_STYLE;
}
