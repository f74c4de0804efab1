/** schema-files.ts for the browser bundle: the same schema files, inlined by esbuild. */
import coffee from './schemas/coffee.schema.json' with { type: 'json' };
import log from './schemas/log.schema.json' with { type: 'json' };
import pot from './schemas/pot.schema.json' with { type: 'json' };
import site from './schemas/site.schema.json' with { type: 'json' };
import stove from './schemas/stove.schema.json' with { type: 'json' };
import type { SchemaName } from './schema-check.ts';

const schemas: Record<SchemaName, object> = { coffee, log, pot, site, stove };

export function readSchema(name: SchemaName): object {
  return schemas[name];
}
