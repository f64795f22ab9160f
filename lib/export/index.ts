export { dispersionCsv, csvText, type CsvOptions } from './dispersion-csv';
export { dispersionYaml, type ExportProvenance } from './dispersion-yaml';
export { dispersionSvg, type SvgOptions } from './plot-svg';
export { reviewRecordHtml, SCREENING_CAUTION, type ReviewRecordData, type RecordPerson } from './review-record';
export { contentDisposition, exportFilename, safeBaseName } from './filename';
