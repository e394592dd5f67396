import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import v8 from 'node:v8';
import { parse } from 'yaml';
import { describe, expect, it } from 'vitest';
import { loadOpenApiDocument, openApiPath } from '../openapi.js';
import { computeSpectrum } from '../services/compute.js';

/**
 * Whether V8 holds `text` one byte a character. V8's value serialiser (`v8.serialize`, the
 * structured-clone format) writes, after its two header bytes, the tag `"` (0x22) before a
 * one-byte string and `c` (0x63) before a two-byte one.
 */
function isOneByte(text: string): boolean {
  return v8.serialize(text)[2] === 0x22;
}

/** Every property name in a parsed YAML value, depth first. */
function namesIn(value: unknown, names: string[] = []): string[] {
  if (Array.isArray(value)) for (const item of value) namesIn(item, names);
  else if (value && typeof value === 'object')
    for (const [name, item] of Object.entries(value)) {
      names.push(name);
      namesIn(item, names);
    }
  return names;
}

// Loaded before anything below builds an object with the document's names, as createApp does.
const document = loadOpenApiDocument();

describe('loadOpenApiDocument: the document as written, its names one byte a character', () => {
  it('equals the document parsed from its UTF-8 text, descriptions beyond Latin-1 included', () => {
    const text = readFileSync(openApiPath, 'utf8');
    expect(text).toMatch(/[\u0100-\uffff]/); // the case the loader is for: − ≤ Ω … in descriptions
    expect(document).toEqual(parse(text));
  });

  it('refuses a string mixing a YAML escape beyond Latin-1 with UTF-8 characters, naming it', () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'openapi-'));
    try {
      const file = path.join(dir, 'mixed.yaml');
      writeFileSync(file, 'info:\n  title: "a \\u2212 b − c"\n  version: 1\n', 'utf8');
      expect(() => loadOpenApiDocument(file)).toThrow(
        /openapi\.yaml: "a − b .*" mixes escapes beyond Latin-1 with UTF-8 characters/,
      );
      writeFileSync(file, 'info:\n  title: "a \\u2212 b"\n  summary: a − b\n', 'utf8');
      expect(loadOpenApiDocument(file)).toEqual({ info: { title: 'a − b', summary: 'a − b' } });
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });

  it('holds only ASCII names (the loader decodes values only)', () => {
    const names = namesIn(document);
    expect(names.length).toBeGreaterThan(1000);
    expect(names.filter((name) => /[^ -~]/.test(name))).toEqual([]);
  });

  it('gives objects built with its names one-byte JSON', () => {
    const twoByte = [...new Set(namesIn(document))].filter(
      (name) => !isOneByte(JSON.stringify({ [name]: 0 })),
    );
    expect(twoByte).toEqual([]);
  });

  it('leaves a spectrum answer computed afterwards one-byte JSON (60 kB, not 120 kB)', () => {
    const answer = JSON.stringify(
      computeSpectrum(
        { method: 'sine-triangle', scheme: 'bipolar', ma: 0.9, mf: 21, vdc: 400 },
        1050,
      ),
    );
    expect(answer.length).toBeGreaterThan(50_000);
    expect(isOneByte(answer)).toBe(true);
  });
});
