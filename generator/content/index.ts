/**
 * The content layer: YAML files in, validated SI entries out (see catalogue.ts for the
 * pipeline). Everything other parts of the generator use is exported here.
 */
export { loadCatalogue } from './catalogue.ts';
export { loadCoffeeFile, loadLogFile, loadPotFile, loadStoveFile } from './load-file.ts';
export { ContentErrors, ContentIssue, type ContentIssueCode } from './issues.ts';
export {
  fieldName,
  nodeAt,
  parseYamlSource,
  positionAt,
  rangeAt,
  type YamlPath,
  type YamlSource,
} from './yaml-source.ts';
export type * from './types.ts';
export { message, type ContentMessage, type ContentMessageKey } from './messages.ts';
