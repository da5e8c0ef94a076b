/** The self-contained HTML report (public barrel). */
export { buildReport, type ReportInput } from './build-report';
export { collectReportFigures, type BuiltFigure } from './collect-report-figures';
export { embedJson } from './embed-json';
export { embedScript } from './embed-script';
export { escapeHtml } from './escape-html';
