import { execFile } from 'node:child_process';
import { readFileSync, readlinkSync, realpathSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { BIN } from './runCli.js';

const root = fileURLToPath(new URL('../../../../', import.meta.url));

describe('the pulsewright bin in the workspace', () => {
  it("is linked by npm install into the root node_modules/.bin, to the package's bin script", () => {
    const link = `${root}node_modules/.bin/pulsewright`;
    expect(readlinkSync(link)).toBe('../@pulsewright/cli/bin/pulsewright.js');
    expect(realpathSync(link)).toBe(realpathSync(BIN));
    // The lock file records the bin, so `npm ci` links it in a fresh clone too.
    const lock = JSON.parse(readFileSync(`${root}package-lock.json`, 'utf8')) as {
      packages: Record<string, { bin?: Record<string, string> }>;
    };
    expect(lock.packages['packages/cli']?.bin).toEqual({ pulsewright: 'bin/pulsewright.js' });
  });

  it('runs through npx from the repository root', async () => {
    const stdout = await new Promise<string>((resolve, reject) =>
      execFile(
        'npx',
        ['--no-install', 'pulsewright', '--version'],
        { cwd: root, encoding: 'utf8' },
        (error, out) =>
          error
            ? reject(new Error('npx pulsewright --version failed', { cause: error }))
            : resolve(out),
      ),
    );
    expect(stdout).toBe('0.1.0\n');
  });
});
