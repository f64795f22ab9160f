export { dispersionCsv, dispersionCsvChunks, csvText, type CsvOptions } from './dispersion-csv';
export { dispersionYaml, dispersionYamlChunks, type ExportProvenance } from './dispersion-yaml';
export { textStream } from './text-stream';
export { dispersionSvg, type SvgOptions } from './plot-svg';
export { reviewRecordHtml, SCREENING_CAUTION, type ReviewRecordData, type RecordPerson } from './review-record';
export { contentDisposition, exportFilename, safeBaseName } from './filename';
