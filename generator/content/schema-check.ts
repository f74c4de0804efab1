/**
 * Checks a file's data against its JSON Schema (schemas/<kind>.schema.json, the same
 * files editors use through the `# yaml-language-server: $schema=…` line) and turns each
 * ajv error into an issue at the YAML node's line and column, as a message key and facts
 * (./messages.ts; the words are generator/words/content.ts).
 */
import AjvModule, { type ErrorObject, type ValidateFunction } from 'ajv';
import { message, type ContentMessage, type ValueSpec } from './messages.ts';
import { readSchema } from './schema-files.ts';
import { ID_PATTERN, idLike } from './ids.ts';
import { COLOUR_PATTERN } from './colour.ts';
import { ContentIssue, type ContentIssueCode, wholeFile } from './issues.ts';
import { nearest } from './nearest.ts';
import {
  fieldName,
  issueAt,
  locate,
  nodeAt,
  type YamlPath,
  type YamlSource,
} from './yaml-source.ts';

export type SchemaName = 'pot' | 'coffee' | 'stove' | 'log' | 'site';

const Ajv = AjvModule.default;
const ajv = new Ajv({
  allErrors: true,
  verbose: true,
  strict: true,
  strictNumbers: true,
  allowUnionTypes: true,
});
type Schema = Readonly<Record<string, unknown>>;

// `x-unit` names the unit of a number for the error words; editors ignore it.
ajv.addKeyword({ keyword: 'x-unit', schemaType: 'string' });
// `x-one-of-keys`: pairs of keys of which exactly one is written (`valve_height_mm` or
// `valve_height_in`); `x-at-most-one-of-keys`: pairs of which one may be written
// (`kettle_presets_c` or `kettle_presets_f`). A pair broken is an error of the keyword.
function keyPairs(required: boolean) {
  return function pairsCheck(
    pairs: readonly (readonly [string, string])[],
    data: object,
    parentSchema?: Schema,
  ): boolean {
    const errors: Partial<ErrorObject>[] = [];
    for (const [first, second] of pairs) {
      const written = [first, second].filter((key) => Object.hasOwn(data, key));
      if (written.length === 1 || (written.length === 0 && !required)) continue;
      errors.push({
        keyword: 'x-one-of-keys',
        params: {
          pair: [first, second],
          both: written.length === 2,
          properties: parentSchema?.properties,
        },
        message:
          written.length === 2 ? `both ${first} and ${second}` : `neither ${first} nor ${second}`,
      });
    }
    (pairsCheck as { errors?: Partial<ErrorObject>[] }).errors = errors;
    return errors.length === 0;
  };
}
for (const [keyword, required] of [
  ['x-one-of-keys', true],
  ['x-at-most-one-of-keys', false],
] as const) {
  ajv.addKeyword({
    keyword,
    type: 'object',
    schemaType: 'array',
    errors: true,
    validate: keyPairs(required),
  });
}

const compiled = new Map<SchemaName, ValidateFunction>();

function validator(name: SchemaName): ValidateFunction {
  let validate = compiled.get(name);
  if (!validate) {
    validate = ajv.compile(readSchema(name));
    compiled.set(name, validate);
  }
  return validate;
}

function specOf(schema: Schema | undefined): ValueSpec {
  if (!schema) return {};
  const type = Array.isArray(schema.type)
    ? schema.type.includes('string')
      ? 'string'
      : schema.type[0]
    : schema.type;
  const examples = schema.examples as readonly unknown[] | undefined;
  return {
    type: type as string | undefined,
    unit: schema['x-unit'] as string | undefined,
    minimum: schema.minimum as number | undefined,
    maximum: schema.maximum as number | undefined,
    allowed: schema.enum as readonly string[] | undefined,
    minItems: schema.minItems as number | undefined,
    maxItems: schema.maxItems as number | undefined,
    example: examples?.[0],
  };
}

function pathOf(instancePath: string): YamlPath {
  if (instancePath === '') return [];
  return instancePath
    .slice(1)
    .split('/')
    .map((part) => part.replaceAll('~1', '/').replaceAll('~0', '~'))
    .map((part) => (/^(0|[1-9]\d*)$/.test(part) ? Number(part) : part));
}

/** The user's own text of a scalar (so 1e400 reads as 1e400, not Infinity). */
function sourceText(source: YamlSource, path: YamlPath): string | undefined {
  const node = nodeAt(source, path) as { source?: unknown } | undefined;
  return typeof node?.source === 'string' ? node.source : undefined;
}

function toIssue(error: ErrorObject, source: YamlSource): ContentIssue {
  const path = pathOf(error.instancePath);
  const schema = error.parentSchema as Schema | undefined;
  const spec = specOf(schema);
  const data: unknown = error.data;
  const at = (
    code: ContentIssueCode,
    wording: ContentMessage,
    where: YamlPath = path,
    on: 'value' | 'key' = 'value',
  ) => issueAt(source, where, code, wording, on);

  switch (error.keyword) {
    case 'required': {
      const key = String(error.params.missingProperty);
      const properties = schema?.properties as Readonly<Record<string, Schema>> | undefined;
      const wording = message('missingKey', key, fieldName(path), specOf(properties?.[key]));
      // Point at the mapping the key belongs in (at its own key, `base:`), naming the missing field.
      const where = { ...locate(source, path, 'key'), field: fieldName([...path, key]) };
      return new ContentIssue('missing-key', where, wording);
    }
    case 'x-one-of-keys': {
      const [first, second] = error.params.pair as [string, string];
      if (error.params.both) {
        return at('repeated', message('bothUnits', first, second), [...path, second], 'key');
      }
      const properties = error.params.properties as Readonly<Record<string, Schema>> | undefined;
      const wording = message(
        'lengthMissing',
        first,
        second,
        fieldName(path),
        specOf(properties?.[first]),
        specOf(properties?.[second]),
      );
      const where = { ...locate(source, path, 'key'), field: fieldName([...path, first]) };
      return new ContentIssue('missing-key', where, wording);
    }
    case 'additionalProperties': {
      const key = String(error.params.additionalProperty);
      const allowed = Object.keys((schema?.properties as object | undefined) ?? {});
      const wording = message('unknownKey', key, fieldName(path), nearest(key, allowed), allowed);
      return at('unknown-key', wording, [...path, key], 'key');
    }
    case 'type': {
      if (typeof data === 'number' && !Number.isFinite(data)) {
        return at(
          'out-of-range',
          message('notFinite', spec, sourceText(source, path) ?? String(data)),
        );
      }
      return at('wrong-type', message('wrongType', spec, data, sourceText(source, path)));
    }
    case 'minimum':
    case 'maximum':
      return at(
        'out-of-range',
        message('outOfRange', spec, data as number, sourceText(source, path)),
      );
    case 'enum': {
      const allowed = (error.params.allowedValues as readonly unknown[]).map(String);
      const suggestion = typeof data === 'string' ? nearest(data, allowed) : undefined;
      return at('bad-enum', message('badEnum', data, allowed, suggestion));
    }
    case 'minItems':
    case 'maxItems':
      return at('bad-value', message('listLength', spec, (data as readonly unknown[]).length));
    case 'minLength':
    case 'maxLength':
      return at(
        'bad-value',
        message('textLength', schema?.maxLength as number | undefined, String(data).length),
      );
    case 'pattern': {
      const text = String(data);
      const wording =
        schema?.pattern === ID_PATTERN.source
          ? message('badId', text, idLike(text))
          : schema?.pattern === COLOUR_PATTERN.source
            ? message('badColour', text)
            : message('badUrl', text);
      return at('bad-value', wording);
    }
    case 'uniqueItems': {
      const index = Math.max(Number(error.params.i), Number(error.params.j)); // the later repeat
      return at('repeated', message('repeatedItem', (data as readonly unknown[])[index]), [
        ...path,
        index,
      ]);
    }
    default:
      return at('bad-value', message('invalidValue', error.message ?? error.keyword));
  }
}

/** Every schema violation in `data`, as issues at their YAML positions. */
export function schemaIssues(name: SchemaName, data: unknown, source: YamlSource): ContentIssue[] {
  const validate = validator(name);
  if (validate(data)) return [];
  const errors = validate.errors ?? [];
  // Each issue looks its place up in the file: capped, so a file of 76,000 unknown keys
  // costs 50 lookups, not 76,000 (each one a walk through the mapping).
  const issues = errors.slice(0, MAX_ISSUES_PER_FILE).map((error) => toIssue(error, source));
  if (errors.length > MAX_ISSUES_PER_FILE) {
    const more = errors.length - MAX_ISSUES_PER_FILE;
    issues.push(
      new ContentIssue('more-problems', wholeFile(source.file), message('moreProblems', more)),
    );
  }
  return issues;
}

/** The schema problems of one file turned into issues; the rest are counted. */
export const MAX_ISSUES_PER_FILE = 50;
