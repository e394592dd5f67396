// Build steps of @pulsewright/client that are more than one command:
//   node scripts.mjs copy-schema   copies the generated src/schema.d.ts into dist/ (tsc does
//                                  not emit .d.ts inputs, and dist/index.d.ts imports it).
import { copyFileSync, mkdirSync } from 'node:fs';

const step = process.argv[2];
if (step === 'copy-schema') {
  mkdirSync('dist', { recursive: true });
  copyFileSync('src/schema.d.ts', 'dist/schema.d.ts');
} else {
  console.error(`unknown step ${step}`);
  process.exit(1);
}
