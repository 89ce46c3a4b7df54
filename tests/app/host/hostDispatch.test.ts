import fc from 'fast-check';
import { describe, expect, it, vi } from 'vitest';
import { createHostDispatch } from '../../../app/host/hostDispatch';
import { createHostServices } from '../../../app/host/hostServices';
import { hostCallNames, hostContract, hostResultSchema, type HostHandlers } from '../../../core/contract';
import { demoEnvironment } from './hostFixtures';

// The rules checked here are the contract's own (design.md §6) and the Electron security
// checklist's "Validate the sender of all IPC messages" / "do not expose raw IPC" items
// (electronjs.org/docs/latest/tutorial/security, items 17 and 20): whatever the payload, the
// service sees only a request its schema accepts, and the caller only an answer the contract
// allows. fast-check (an outside library) makes the payloads; its seed is fixed.

function handlersWith(overrides: Partial<HostHandlers>): HostHandlers {
  return { ...createHostServices(demoEnvironment()), ...overrides };
}

describe('the registration function both transports use', () => {
  it('refuses a name outside the contract without running anything', async () => {
    const answer = await createHostDispatch(handlersWith({}))('readFile', { path: '/etc/passwd' });
    expect(answer).toEqual({ ok: false, issues: [expect.objectContaining({ code: 'not_available', message: 'There is no host call named "readFile".' })] });
  });

  it('refuses a payload its schema refuses, naming the field, and never calls the service', async () => {
    const openCase = vi.fn();
    const dispatch = createHostDispatch(handlersWith({ openCase }));
    const answer = await dispatch('openCase', { caseId: '../../etc/passwd.json' });
    expect(answer.ok).toBe(false);
    if (answer.ok) return;
    expect(answer.issues[0]?.path).toEqual(['caseId']);
    expect(answer.issues[0]?.message).toMatch(/^caseId /);
    const extra = await dispatch('openCase', { caseId: 'th-0417.json', path: '/etc' });
    expect(extra.ok).toBe(false);
    if (!extra.ok) expect(extra.issues[0]?.message).toBe('path is not a field of the openCase request here; check its spelling.');
    const notAnObject = await dispatch('listCases', 'all');
    expect(notAnObject.ok).toBe(false);
    if (!notAnObject.ok) expect(notAnObject.issues[0]?.message).toMatch(/^The request to listCases is "all"/);
    expect(openCase).not.toHaveBeenCalled();
  });

  it('turns a service that throws into one issue naming the call, with no stack trace', async () => {
    const onUnexpected = vi.fn();
    const dispatch = createHostDispatch(handlersWith({ listCases: () => { throw new Error('EACCES at Object.readdirSync (node:fs:1:1)'); } }), { onUnexpected });
    const answer = await dispatch('listCases', {});
    expect(answer).toEqual({ ok: false, issues: [expect.objectContaining({ code: 'host_failed' })] });
    if (!answer.ok) expect(answer.issues[0]?.message).not.toMatch(/node:fs|at |EACCES/);
    expect(onUnexpected).toHaveBeenCalledWith('listCases', expect.any(Error));
  });

  it('refuses a service answer outside the contract', async () => {
    const dispatch = createHostDispatch(handlersWith({ appInfo: () => ({ ok: true, value: { name: 'x', version: 1 as unknown as string } }) }));
    const answer = await dispatch('appInfo', {});
    expect(answer).toEqual({ ok: false, issues: [expect.objectContaining({ code: 'host_failed', message: 'The host answered appInfo outside the contract; the work on screen is kept.' })] });
  });

  it('always resolves to an answer the contract allows, whatever the name and payload', async () => {
    const dispatch = createHostDispatch(handlersWith({}));
    await fc.assert(
      fc.asyncProperty(fc.constantFrom(...hostCallNames, 'constructor', '__proto__', 'toString'), fc.anything(), async (name, payload) => {
        const answer = await dispatch(name, payload);
        const schema = hostResultSchema((hostContract as Record<string, { response: import('zod').ZodType }>)[name]?.response ?? hostContract.appInfo.response);
        expect(schema.safeParse(answer).success).toBe(true);
      }),
      { seed: 14, numRuns: 300 },
    );
  });
});
