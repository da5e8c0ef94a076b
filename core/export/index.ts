/** Unit table exports and their readers (public barrel). */
export { buildRunRecord, type CurationSummary, type RunRecordInput } from './build-run-record';
export { formatTable, TABLE_FORMATS, type TableFormat } from './format-table';
export { formatTableJson, TABLE_JSON_FORMAT, TABLE_JSON_VERSION } from './format-table-json';
export { parseDelimited } from './parse-delimited';
export { readDelimitedTable } from './read-delimited-table';
export { readTableJson } from './read-table-json';
