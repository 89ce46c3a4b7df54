import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { parse } from 'yaml';

const root = fileURLToPath(new URL('../..', import.meta.url));
const config = parse(readFileSync(`${root}electron-builder.yml`, 'utf8'));
const pkg = JSON.parse(readFileSync(`${root}package.json`, 'utf8'));

// electron-builder cannot run here (it downloads Electron), so the configuration is
// checked as data against the Electron security checklist (electronjs.org/docs/latest/
// tutorial/security, "fuses" and "asar integrity" items) and against package.json.
describe('repository layout (design card)', () => {
  it('has the top-level entries the design card lists', async () => {
    const { existsSync } = await import('node:fs');
    for (const entry of ['package.json', 'electron-builder.yml', 'tsconfig.json', 'README.md', 'DEVELOPERS.md', 'app', 'renderer', 'core', 'tests', 'assets', '.ci/run']) {
      expect(existsSync(`${root}${entry}`), entry).toBe(true);
    }
  });
});

describe('electron-builder.yml', () => {
  it('is valid YAML naming the product as package.json does', () => {
    expect(config.productName).toBe(pkg.name);
    expect(config.appId).toMatch(/^[a-z0-9.-]+$/);
  });

  it('ships the app in an asar archive with the security fuses set', () => {
    expect(config.asar).toBe(true);
    expect(config.electronFuses).toEqual({
      runAsNode: false,
      enableCookieEncryption: true,
      enableNodeOptionsEnvironmentVariable: false,
      enableNodeCliInspectArguments: false,
      enableEmbeddedAsarIntegrityValidation: true,
      onlyLoadAppFromAsar: true,
    });
  });

  it('packages only built output and package.json, never sources or tests', () => {
    expect(config.files).toContain('dist/**/*');
    expect(config.files.some((it: string) => it.startsWith('core') || it.startsWith('tests'))).toBe(false);
  });

  it('keeps React and build tools out of the runtime dependencies (stack notes)', () => {
    const runtime = Object.keys(pkg.dependencies ?? {});
    for (const devOnly of ['react', 'react-dom', 'vite', 'vitest', 'typescript', 'esbuild', 'electron']) {
      expect(runtime).not.toContain(devOnly);
    }
  });
});
