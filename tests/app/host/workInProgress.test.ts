import { describe, expect, it } from 'vitest';
import { createWorkInProgress } from '../../../app/host/workInProgress';

// The register of long work on its own, with work of our own making held by promises this test
// releases (no clock is read and nothing is timed). The rules checked are the ones the contract's
// cancelWork states: a cancel is honoured between steps, never once a save has begun, and a cancel
// that reaches the host before its call still stops it.

/** Work that reports one step, then waits for `release` before it finishes (or saves, when told to be unstoppable). */
function heldWork(options: { unstoppable?: boolean } = {}) {
  let release: () => void = () => undefined;
  const held = new Promise<void>((resolve) => (release = resolve));
  let reported: () => void = () => undefined;
  const stepReported = new Promise<void>((resolve) => (reported = resolve));
  const work = async (ticket: Parameters<Parameters<ReturnType<typeof createWorkInProgress>['run']>[1]>[0]) => {
    await ticket.report('Reading x.csv', 1, 3);
    if (options.unstoppable) ticket.unstoppable();
    reported();
    await held;
    return ticket.cancelled() ? 'stopped' : 'done';
  };
  return { work, release: () => release(), stepReported };
}

describe('the register of work in progress', () => {
  it('answers the step of running work, null before and after it, and stops it when cancelled', async () => {
    const register = createWorkInProgress();
    expect(register.progress('work-0001')).toBeNull();
    const { work, release, stepReported } = heldWork();
    const running = register.run('work-0001', work);
    await stepReported;
    expect(register.progress('work-0001')).toEqual({ step: 'Reading x.csv', done: 1, total: 3 });
    expect(register.cancel('work-0001')).toEqual({ stopping: true });
    release();
    expect(await running).toBe('stopped');
    expect(register.progress('work-0001')).toBeNull();
    expect(register.cancel('work-0001')).toEqual({ stopping: false });
  });

  it('says a save under way will not stop, and lets it finish', async () => {
    const register = createWorkInProgress();
    const { work, release, stepReported } = heldWork({ unstoppable: true });
    const running = register.run('saving-0001', work);
    await stepReported;
    expect(register.cancel('saving-0001')).toEqual({ stopping: false });
    release();
    expect(await running).toBe('done');
  });

  it('remembers a cancel that comes before its work, and leaves work without an id alone', async () => {
    const register = createWorkInProgress();
    expect(register.cancel('early-0001')).toEqual({ stopping: true });
    const early = heldWork();
    const stopped = register.run('early-0001', early.work);
    early.release();
    expect(await stopped).toBe('stopped');
    const untracked = heldWork();
    const done = register.run(undefined, untracked.work);
    untracked.release();
    expect(await done).toBe('done');
  });

  it('forgets the oldest finished ids beyond the last 200, never running ones', async () => {
    const register = createWorkInProgress();
    const { work, release, stepReported } = heldWork();
    const running = register.run('still-running', work);
    await stepReported;
    for (let index = 0; index < 201; index += 1) await register.run(`finished-${String(index).padStart(4, '0')}`, async () => 'done');
    // The oldest finished id is forgotten: a cancel of it now reads as one that came before its work.
    expect(register.cancel('finished-0000')).toEqual({ stopping: true });
    expect(register.cancel('finished-0200')).toEqual({ stopping: false });
    expect(register.progress('still-running')).toEqual({ step: 'Reading x.csv', done: 1, total: 3 });
    release();
    await running;
  });
});
