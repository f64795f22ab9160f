export { writeColumns, type ColumnsOptions, type LeadingColumns } from './columns';
export { writeYaml, type YamlOptions } from './yaml';
export { formatNumber } from './format-number';
