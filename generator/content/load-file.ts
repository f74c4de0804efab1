/**
 * One entry file on its own, for the CLI (`stovecard simulate --pot FILE`). Errors name the
 * file by the path as given. References to other files are not checked here.
 */
import { buildCoffee } from './coffee.ts';
import { loadEntry, type Checked, type ValidFile } from './entry-file.ts';
import { ContentErrors } from './issues.ts';
import { buildLog, type LogYaml } from './log.ts';
import { buildPot } from './pot.ts';
import { buildStove } from './stove.ts';
import type { CoffeeEntry, LogEntry, PotEntry, StoveEntry } from './types.ts';

async function valueOrThrow<E>(checked: Promise<Checked<E>>): Promise<E> {
  const { value, issues } = await checked;
  if (value === undefined) throw new ContentErrors(issues);
  return value;
}

export async function loadPotFile(path: string): Promise<PotEntry> {
  return valueOrThrow(loadEntry('pot', path, path, buildPot));
}

export async function loadCoffeeFile(path: string): Promise<CoffeeEntry> {
  return valueOrThrow(loadEntry('coffee', path, path, buildCoffee));
}

export async function loadStoveFile(path: string): Promise<StoveEntry> {
  return valueOrThrow(loadEntry('stove', path, path, buildStove));
}

export async function loadLogFile(path: string): Promise<LogEntry> {
  return valueOrThrow(loadEntry('log', path, path, (file: ValidFile<LogYaml>) => buildLog(file)));
}
