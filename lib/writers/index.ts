export { writeColumns, type ColumnsOptions, type LeadingColumns } from './columns';
export { writeYaml, yamlChunks, type YamlOptions } from './yaml';
export { formatNumber } from './format-number';
export { checkFinite, chunkLines, joinChunks, pointPlace, CHUNK_CHARS } from './chunks';
