// The child process of the kill test: saves a case over and over until it is
// killed. State n is the base case with one review note "save n"; each save
// writes state n + 1 over state n through the case store (journal line, then
// the atomic write). Started by killHarness.ts, never by hand.
import { openCaseStore } from '../../../../app/host/caseStore';
import { stateAt, stateIndexOf } from './killStates';

async function main(): Promise<void> {
  const [folder, fileName] = process.argv.slice(2);
  if (!folder || !fileName) throw new Error('usage: saveLoop <folder> <file>');
  const store = openCaseStore(folder);
  let announced = false;
  for (;;) {
    const opened = await store.open(fileName);
    if (!opened.ok) throw new Error(`cannot open: ${opened.issues.map((it) => it.message).join('; ')}`);
    const next = stateIndexOf(opened.value.caseFile) + 1;
    if (!announced) {
      process.stdout.write('ready\n');
      announced = true;
    }
    const saved = await store.save(fileName, stateAt(next), { expected: opened.value.revision, change: `save ${next}` });
    if (!saved.ok) throw new Error(`cannot save: ${saved.issues.map((it) => it.message).join('; ')}`);
  }
}

main().catch((error: unknown) => {
  process.stderr.write(`${(error as Error).message}\n`);
  process.exit(3);
});
