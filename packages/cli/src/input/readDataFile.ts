import { readFileSync } from 'node:fs';
import { extname } from 'node:path';
import { parse as parseYaml } from 'yaml';
import { InputError } from '../errors.js';

/**
 * Reads a JSON or YAML document: `path` ending in `.json` is parsed as JSON, anything else as
 * YAML 1.2 (which also reads JSON); `-` reads standard input. `field` names the input in errors.
 * @throws InputError when the file cannot be read or parsed (the parser's line and column)
 */
export function readDataFile(path: string, field: string): unknown {
  let text: string;
  try {
    text = readFileSync(path === '-' ? 0 : path, 'utf8');
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    const why =
      code === 'ENOENT'
        ? 'no such file'
        : code === 'EISDIR'
          ? 'it is a directory'
          : (error as Error).message;
    throw new InputError(field, `${field} ${path} cannot be read: ${why}`);
  }
  const name = path === '-' ? 'standard input' : path;
  if (extname(path).toLowerCase() === '.json') {
    try {
      return JSON.parse(text) as unknown;
    } catch (error) {
      throw new InputError(
        field,
        `${field} ${name} is not valid JSON: ${(error as Error).message}`,
      );
    }
  }
  try {
    return parseYaml(text, { prettyErrors: true }) as unknown;
  } catch (error) {
    throw new InputError(
      field,
      `${field} ${name} is not valid YAML or JSON: ${(error as Error).message.split('\n')[0]}`,
    );
  }
}
