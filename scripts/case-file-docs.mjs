// Writes docs/case-file.md and docs/case-file.schema.json from the zod schema
// in core/model (see app/build/caseFileDocs.ts). Usage: node scripts/case-file-docs.mjs
import { build } from 'esbuild';
import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

const root = fileURLToPath(new URL('..', import.meta.url));
mkdirSync(join(root, 'tests/.results'), { recursive: true });
const work = mkdtempSync(join(root, 'tests/.results/case-file-docs-'));
try {
  const entry = join(work, 'entry.ts');
  writeFileSync(
    entry,
    `export { caseFileJsonSchema, caseFileMarkdown, caseFileDocPath, caseFileSchemaPath } from ${JSON.stringify(join(root, 'app/build/caseFileDocs.ts'))};
export { parseCase } from ${JSON.stringify(join(root, 'core/model/parseCase.ts'))};`,
  );
  const out = join(work, 'docs.mjs');
  await build({ entryPoints: [entry], outfile: out, bundle: true, platform: 'node', target: 'node20', format: 'esm', logLevel: 'warning' });
  const docs = await import(pathToFileURL(out).href);
  const demos = ['th-0417', 'th-0093'].map((name) => {
    const parsed = docs.parseCase(JSON.parse(readFileSync(join(root, `assets/demo/${name}.json`), 'utf8')));
    if (!parsed.ok) throw new Error(`${name} does not parse`);
    return JSON.parse(JSON.stringify(parsed.value));
  });
  const schema = docs.caseFileJsonSchema();
  mkdirSync(join(root, 'docs'), { recursive: true });
  writeFileSync(join(root, docs.caseFileSchemaPath), `${JSON.stringify(schema, null, 2)}\n`);
  writeFileSync(join(root, docs.caseFileDocPath), docs.caseFileMarkdown(schema, demos));
  console.log(`wrote ${docs.caseFileDocPath} and ${docs.caseFileSchemaPath}`);
} finally {
  rmSync(work, { recursive: true, force: true });
}
